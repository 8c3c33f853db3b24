/** Text or an attribute value made safe inside HTML: `& < > " '` as character references. */
export function escapeHtml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

/**
 * JSON text safe inside `<script type="application/json">`: `<`, `>` and `&` as `\u003c`-style
 * escapes, so no `</script>` or `<!--` can end or change the element; JSON.parse reads back
 * the same value.
 */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value).replace(/</g, '\\u003c').replace(/>/g, '\\u003e').replace(/&/g, '\\u0026');
}

/** A string usable inside an HTML id and a URL fragment: anything else becomes `_`. */
export function idPart(s: string): string {
  return s.replace(/[^A-Za-z0-9_.-]/g, '_');
}
