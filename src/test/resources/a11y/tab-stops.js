// Marks the interactive elements of the main content in document order (data-tab-stop = index) and returns, per
// element, its unfocused outline and box shadow, so the test can compare them with the focused state.
// Radio buttons of one group are one tab stop (the checked one, else the first), as browsers treat them.
var main = document.querySelector('main');
// Chromium lays out the content of a closed <details> (content-visibility), so rects alone do not say it is shown:
// an element inside a closed <details> is shown only when it is that details' own summary or inside it.
function shown(el) {
  for (var d = el.closest('details:not([open])'); d; d = d.parentElement ? d.parentElement.closest('details:not([open])') : null) {
    var summary = d.querySelector(':scope > summary');
    if (!summary || !summary.contains(el)) { return false; }
  }
  return true;
}
// the unfocused look is read with nothing focused (a page may focus its first field itself)
if (document.activeElement) { document.activeElement.blur(); }
var seenGroups = {};
var stops = [];
main.querySelectorAll('a[href], button, input, select, textarea, summary, [tabindex]').forEach(function (el) {
  if (el.type === 'hidden' || el.disabled || el.tabIndex < 0 || !el.getClientRects().length || !shown(el)) { return; }
  if (getComputedStyle(el).visibility === 'hidden') { return; }
  if (el.type === 'radio' && el.name) {
    if (seenGroups[el.name]) { return; }
    var group = main.querySelectorAll('input[type=radio][name="' + el.name + '"]');
    var checked = Array.prototype.find.call(group, function (r) { return r.checked; });
    el = checked || el;
    seenGroups[el.name] = true;
  }
  var s = getComputedStyle(el);
  el.setAttribute('data-tab-stop', String(stops.length));
  stops.push(el.tagName.toLowerCase() + (el.id ? '#' + el.id : '') + ' ' + s.outlineStyle + ' ' + s.outlineWidth
      + ' ' + s.outlineColor + ' | ' + s.boxShadow);
});
return stops;
