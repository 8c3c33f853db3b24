/**
 * The report's only script, inlined: sorts and filters the rule table and switches slice plots.
 * Plain ES2017 with no libraries; the page reads fully without it (every rule row and the first
 * slice plot are in the HTML), so a viewer that blocks scripts still shows the evidence.
 *
 * Filtering touches each row once (`hidden`); sorting re-appends the rows in one fragment.
 */
export const PAGE_SCRIPT = `
(function () {
  'use strict';
  var table = document.getElementById('rules');
  var body = table.tBodies[0];
  var rows = Array.prototype.slice.call(body.rows);
  var adv = document.getElementById('filter-advisory');
  var st = document.getElementById('filter-status');
  var shown = document.getElementById('rule-count');
  function applyFilter() {
    var a = adv.value, s = st.value, n = 0;
    for (var i = 0; i < rows.length; i++) {
      var r = rows[i];
      var ok = (!a || (' ' + r.getAttribute('data-advisory') + ' ').indexOf(' ' + a + ' ') >= 0) &&
        (!s || r.getAttribute('data-status') === s);
      r.hidden = !ok;
      if (ok) n++;
    }
    shown.textContent = n + ' of ' + rows.length + ' rules shown';
  }
  adv.addEventListener('change', applyFilter);
  st.addEventListener('change', applyFilter);
  var heads = table.tHead.rows[0].cells;
  function key(row, col, numeric) {
    var c = row.cells[col];
    if (numeric) { var v = parseFloat(c.getAttribute('data-v')); return isNaN(v) ? -Infinity : v; }
    return c.getAttribute('data-v') || c.textContent;
  }
  Array.prototype.forEach.call(heads, function (th, col) {
    if (!th.hasAttribute('data-sort')) return;
    th.tabIndex = 0;
    function sort() {
      var numeric = th.getAttribute('data-sort') === 'num';
      var dir = th.getAttribute('aria-sort') === 'ascending' ? -1 : 1;
      Array.prototype.forEach.call(heads, function (h) { h.removeAttribute('aria-sort'); });
      th.setAttribute('aria-sort', dir === 1 ? 'ascending' : 'descending');
      var keyed = rows.map(function (r, i) { return { r: r, k: key(r, col, numeric), i: i }; });
      keyed.sort(function (x, y) {
        var c = numeric ? x.k - y.k : String(x.k).localeCompare(String(y.k), 'en', { numeric: true });
        return c !== 0 ? dir * c : x.i - y.i;
      });
      var frag = document.createDocumentFragment();
      keyed.forEach(function (e) { frag.appendChild(e.r); });
      body.appendChild(frag);
      rows = keyed.map(function (e) { return e.r; });
    }
    th.addEventListener('click', sort);
    th.addEventListener('keydown', function (e) { if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); sort(); } });
  });
  var pairSel = document.getElementById('slice-pair');
  var heldSel = document.getElementById('slice-held');
  if (pairSel && heldSel) {
    var figs = Array.prototype.slice.call(document.querySelectorAll('figure.slice'));
    function find(p, h) {
      for (var i = 0; i < figs.length; i++) {
        if (figs[i].getAttribute('data-pair') === p && figs[i].getAttribute('data-held') === h) return figs[i];
      }
      return null;
    }
    function showSlice() {
      var p = pairSel.value;
      // held points that give the same plane for this pair were not drawn twice: disable them
      Array.prototype.forEach.call(heldSel.options, function (o) { o.disabled = !find(p, o.value); });
      if (!find(p, heldSel.value)) {
        for (var j = 0; j < heldSel.options.length; j++) if (!heldSel.options[j].disabled) { heldSel.value = heldSel.options[j].value; break; }
      }
      var target = find(p, heldSel.value);
      figs.forEach(function (f) { f.hidden = f !== target; });
    }
    pairSel.addEventListener('change', showSlice);
    heldSel.addEventListener('change', showSlice);
    showSlice();
  }
  applyFilter();
})();
`;
