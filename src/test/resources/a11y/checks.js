// Accessibility checks run inside the page; returns a list of findings, each one line naming the element.
// Contrast: relative luminance and contrast ratio as defined in WCAG 2.1 (Understanding SC 1.4.3; the
// "relative luminance" and "contrast ratio" definitions in the WCAG 2.1 glossary), thresholds of SC 1.4.3:
// 4.5:1, or 3:1 for large text (at least 18 pt = 24 px, or 14 pt = 18.66 px bold).
var findings = [];
// Chromium lays out the content of a closed <details> (content-visibility), so rects alone do not say it is shown:
// an element inside a closed <details> is shown only when it is that details' own summary or inside it.
function shown(el) {
  for (var d = el.closest('details:not([open])'); d; d = d.parentElement ? d.parentElement.closest('details:not([open])') : null) {
    var summary = d.querySelector(':scope > summary');
    if (!summary || !summary.contains(el)) { return false; }
  }
  return true;
}
function visible(el) {
  if (!el.getClientRects().length || !shown(el)) { return false; }
  var s = getComputedStyle(el);
  return s.visibility !== 'hidden' && s.display !== 'none';
}
function describe(el) {
  var d = el.tagName.toLowerCase();
  if (el.id) { d += '#' + el.id; }
  if (el.className && typeof el.className === 'string') { d += '.' + el.className.trim().split(/\s+/).join('.'); }
  var t = (el.innerText || el.value || '').trim().replace(/\s+/g, ' ');
  return d + (t ? ' "' + t.substring(0, 40) + '"' : '');
}
function text(id) { var e = document.getElementById(id); return e ? (e.innerText || e.textContent || '').trim() : ''; }
function accessibleName(el) {
  if ((el.getAttribute('aria-label') || '').trim()) { return true; }
  var by = el.getAttribute('aria-labelledby');
  if (by && by.split(/\s+/).some(function (id) { return text(id).length > 0; })) { return true; }
  return el.labels && Array.prototype.some.call(el.labels, function (l) { return l.innerText.trim().length > 0; });
}
document.querySelectorAll('input, select, textarea').forEach(function (el) {
  if (el.type === 'hidden' || !visible(el)) { return; }
  if (!accessibleName(el)) { findings.push('label: ' + describe(el) + ' has no accessible name'); }
});
document.querySelectorAll('button, a[href], summary').forEach(function (el) {
  if (!visible(el)) { return; }
  var named = (el.innerText || '').trim() || (el.getAttribute('aria-label') || '').trim()
      || Array.prototype.some.call(el.querySelectorAll('img[alt]'), function (i) { return i.alt.trim(); });
  if (!named) { findings.push('name: ' + describe(el) + ' has no text'); }
});
function rgba(c) {
  var m = /rgba?\(([^)]+)\)/.exec(c);
  if (!m) { return null; }
  var p = m[1].split(/[\s,\/]+/).filter(Boolean).map(parseFloat);
  return [p[0], p[1], p[2], p.length > 3 ? p[3] : 1];
}
function over(top, bottom) {
  var a = top[3];
  return [top[0] * a + bottom[0] * (1 - a), top[1] * a + bottom[1] * (1 - a), top[2] * a + bottom[2] * (1 - a), 1];
}
// the colour behind an element: its own and its ancestors' backgrounds composited bottom-up over white (the canvas)
function background(el) {
  var layers = [];
  for (var e = el; e; e = e.parentElement) {
    var c = rgba(getComputedStyle(e).backgroundColor);
    if (c && c[3] > 0) { layers.push(c); if (c[3] >= 1) { break; } }
  }
  var bg = [255, 255, 255, 1];
  for (var i = layers.length - 1; i >= 0; i--) { bg = over(layers[i], bg); }
  return bg;
}
function luminance(c) {
  var f = function (v) { v = v / 255; return v <= 0.03928 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4); };
  return 0.2126 * f(c[0]) + 0.7152 * f(c[1]) + 0.0722 * f(c[2]);
}
function hex(c) { return '#' + c.slice(0, 3).map(function (v) { return Math.round(v).toString(16).padStart(2, '0'); }).join(''); }
document.querySelectorAll('body *').forEach(function (el) {
  if (el.closest('svg') || !visible(el) || el.disabled) { return; }
  var own = Array.prototype.some.call(el.childNodes, function (n) { return n.nodeType === 3 && n.textContent.trim(); });
  if (!own && !(el.matches('input:not([type=hidden]):not([type=checkbox]):not([type=radio]):not([type=file]), select, textarea') && el.value)) { return; }
  var s = getComputedStyle(el);
  var r = el.getBoundingClientRect();
  if (r.width <= 1 || r.height <= 1) { return; } // clipped away (visually hidden), read only by assistive technology
  var bg = background(el);
  var fg = over(rgba(s.color), bg);
  var l1 = luminance(fg), l2 = luminance(bg);
  var ratio = (Math.max(l1, l2) + 0.05) / (Math.min(l1, l2) + 0.05);
  var size = parseFloat(s.fontSize), bold = parseInt(s.fontWeight, 10) >= 700;
  var large = size >= 24 || (size >= 18.66 && bold);
  var needed = large ? 3 : 4.5;
  if (ratio < needed) {
    findings.push('contrast: ' + describe(el) + ' ' + hex(fg) + ' on ' + hex(bg) + ' is ' + ratio.toFixed(2)
        + ':1, needs ' + needed + ':1 (' + size + 'px' + (bold ? ' bold' : '') + ')');
  }
});
if (document.documentElement.scrollWidth > window.innerWidth) {
  // name the deepest elements that stick out, leaving out what sits in its own scroll container
  var wide = [];
  document.querySelectorAll('body *').forEach(function (el) {
    if (el.getBoundingClientRect().right <= window.innerWidth + 0.5 || (el.parentElement && el.parentElement.closest('svg'))) { return; }
    for (var p = el.parentElement; p; p = p.parentElement) {
      if (/auto|scroll|hidden/.test(getComputedStyle(p).overflowX)) { return; }
    }
    if (!Array.prototype.some.call(el.children, function (c) { return c.getBoundingClientRect().right > window.innerWidth + 0.5; })) {
      wide.push(describe(el));
    }
  });
  findings.push('width: the page scrolls sideways, ' + document.documentElement.scrollWidth + ' px wide in a '
      + window.innerWidth + ' px window; sticking out: ' + wide.slice(0, 5).join(', '));
}
return findings;
