/** The report's stylesheet, inlined in the page (no external files). */
export const PAGE_STYLE = `
:root { --fg: #1a1a1a; --muted: #555; --line: #ccc; --warn-bg: #fff4d6; --warn-line: #b07a00; }
* { box-sizing: border-box; }
body { font: 14px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, sans-serif; color: var(--fg); margin: 0 auto; max-width: 1200px; padding: 1rem 1.5rem 4rem; }
h1 { font-size: 1.5rem; margin: 0.5rem 0; }
h2 { font-size: 1.2rem; margin: 2rem 0 0.5rem; border-bottom: 1px solid var(--line); padding-bottom: 0.2rem; }
h3 { font-size: 1rem; margin: 1rem 0 0.3rem; }
code, .mono { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; font-size: 0.92em; }
.cautions { background: var(--warn-bg); border: 2px solid var(--warn-line); border-radius: 4px; padding: 0.6rem 1rem; margin: 0.8rem 0 1.2rem; }
.cautions h2 { border: 0; margin: 0 0 0.3rem; font-size: 1.05rem; }
.cautions ul { margin: 0; padding-left: 1.2rem; }
table { border-collapse: collapse; margin: 0.4rem 0; }
th, td { border-bottom: 1px solid var(--line); padding: 0.25rem 0.6rem; text-align: left; vertical-align: top; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
dl.kv { display: grid; grid-template-columns: max-content 1fr; gap: 0.15rem 1rem; margin: 0.4rem 0; }
dl.kv dt { color: var(--muted); }
dl.kv dd { margin: 0; overflow-wrap: anywhere; }
.figures { display: flex; flex-wrap: wrap; gap: 0.6rem 2rem; }
.figure { border: 1px solid var(--line); border-radius: 4px; padding: 0.4rem 0.8rem; min-width: 9rem; }
.figure .value { font-size: 1.3rem; font-weight: 600; }
.figure .note { color: var(--muted); font-size: 0.85rem; }
.controls { display: flex; flex-wrap: wrap; gap: 1rem; align-items: center; margin: 0.5rem 0; }
#rules th[data-sort] { cursor: pointer; user-select: none; white-space: nowrap; }
#rules th[data-sort]::after { content: " \\2195"; color: var(--muted); }
#rules th[aria-sort="ascending"]::after { content: " \\2191"; }
#rules th[aria-sort="descending"]::after { content: " \\2193"; }
#rules td.text { font-family: ui-monospace, Menlo, Consolas, monospace; font-size: 0.85rem; min-width: 22rem; }
.status { font-weight: 600; }
.status-refuted { color: #b00018; }
.status-proven { color: #0b5d1e; }
.swatch { display: inline-block; width: 0.9em; height: 0.9em; border: 1px solid #444; vertical-align: -0.1em; margin-right: 0.3em; }
.slice-view { display: flex; flex-wrap: wrap; gap: 1rem; align-items: flex-start; }
figure.slice { margin: 0; max-width: 620px; }
.slice svg { max-width: 100%; height: auto; }
.key svg { vertical-align: middle; margin-right: 0.3rem; }
.key div { margin: 0.2rem 0; }
article.evidence { border-top: 1px solid var(--line); padding: 0.3rem 0 0.6rem; content-visibility: auto; contain-intrinsic-size: auto 10rem; }
article.evidence:target { background: #eef5ff; }
.muted { color: var(--muted); }
.scroll { overflow-x: auto; }
@media print { .controls { display: none; } }
`;
