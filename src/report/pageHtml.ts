/**
 * The self-contained HTML page around a compiled Vega chart. Pure: strings in, string out.
 *
 * Safety of model text (titles, names, notes): everything shown as page text goes through
 * `escapeHtml`; the chart spec is JSON inside <script type="application/json"> with every `<`
 * written as \u003c (so no `</script>` can appear), read back with JSON.parse; tooltip text is set
 * with textContent only. The Content-Security-Policy forbids every network request (no connect,
 * no images or fonts from anywhere but data: URLs) while allowing the inline scripts, and vega's
 * expression compiler, which needs 'unsafe-eval'.
 */
import { CAUTION } from './caution.js';
import type { PageText } from './renderPage.js';

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** JSON that can sit inside a <script> element: no `<` (so no `</script>` or `<!--`), no line separators. */
export function scriptJson(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

/** Code placed in a <script> element must not contain `</script` (vega's build has none; checked anyway). */
function inlineScript(code: string): string {
  return code.replace(/<\/(script)/gi, '<\\/$1');
}

/** Written into the page as it is: it holds no `"`, `<` or `&`. */
const CSP = [
  "default-src 'none'", "script-src 'unsafe-inline' 'unsafe-eval'", "style-src 'unsafe-inline'",
  'img-src data: blob:', 'font-src data:', "connect-src 'none'", "form-action 'none'", "base-uri 'none'",
].join('; ');

const STYLE = `
body { font-family: system-ui, -apple-system, "Segoe UI", Roboto, sans-serif; margin: 1.5rem; color: #1d1d1d; background: #ffffff; }
h1 { font-size: 1.35rem; margin: 0 0 0.3rem 0; }
.bt-subtitle { margin: 0 0 1rem 0; color: #444444; }
#bt-chart { margin: 0.5rem 0 1rem 0; }
.bt-notes { max-width: 52rem; font-size: 0.92rem; color: #333333; padding-left: 1.2rem; }
.bt-caution { max-width: 52rem; border-left: 4px solid #d9730d; background: #fff6ec; padding: 0.6rem 0.9rem; margin: 0.8rem 0; }
.bt-error { color: #a00000; font-weight: bold; }
.bt-tooltip { position: fixed; z-index: 10; max-width: 26rem; pointer-events: none; background: #ffffff;
  border: 1px solid #9a9a9a; border-radius: 3px; box-shadow: 0 2px 6px rgba(0, 0, 0, 0.18);
  padding: 0.35rem 0.5rem; font-size: 0.8rem; line-height: 1.35; }
.bt-tooltip .bt-key { color: #555555; }
`;

/**
 * Runs in the page: renders the spec into #bt-chart as SVG, with our own tooltip box. Sets
 * data-bt-ready on <body> when the first render is done (the browser tests wait for it).
 */
const CLIENT = `
(function () {
  var box = document.createElement('div');
  box.className = 'bt-tooltip';
  box.setAttribute('role', 'tooltip');
  box.hidden = true;
  document.body.appendChild(box);
  function clear() { while (box.firstChild) box.removeChild(box.firstChild); }
  function tooltip(handler, event, item, value) {
    if (value === null || value === undefined || value === '') { box.hidden = true; return; }
    clear();
    if (typeof value === 'object' && !Array.isArray(value)) {
      Object.keys(value).forEach(function (key) {
        var row = document.createElement('div');
        var k = document.createElement('span');
        k.className = 'bt-key';
        k.textContent = key + ': ';
        var v = document.createElement('span');
        v.textContent = String(value[key]);
        row.appendChild(k);
        row.appendChild(v);
        box.appendChild(row);
      });
    } else {
      box.textContent = String(value);
    }
    box.hidden = false;
    var x = event.clientX + 14, y = event.clientY + 14;
    var w = box.offsetWidth, h = box.offsetHeight;
    if (x + w > window.innerWidth - 4) x = Math.max(4, event.clientX - w - 14);
    if (y + h > window.innerHeight - 4) y = Math.max(4, event.clientY - h - 14);
    box.style.left = x + 'px';
    box.style.top = y + 'px';
  }
  function fail(error) {
    var p = document.createElement('p');
    p.className = 'bt-error';
    p.textContent = 'The chart could not be drawn: ' + (error && error.message ? error.message : String(error));
    document.getElementById('bt-chart').appendChild(p);
    console.error(error);
  }
  try {
    var spec = JSON.parse(document.getElementById('bt-chart-spec').textContent);
    var view = new vega.View(vega.parse(spec), { renderer: 'svg', container: '#bt-chart', hover: true, tooltip: tooltip });
    view.runAsync().then(function () { document.body.setAttribute('data-bt-ready', 'true'); }, fail);
  } catch (error) {
    fail(error);
  }
})();
`;

/**
 * The page: header, the caution (always, in a box above the chart, whether or not the notes carry
 * it), the chart, then the other notes.
 */
export function pageHtml(vegaSpec: unknown, text: PageText, vegaCode: string): string {
  const cautionBlock = `<p class="bt-caution"><strong>Caution.</strong> ${escapeHtml(CAUTION)}</p>\n`;
  const restList = text.notes.filter((n) => n !== CAUTION).map((n) => `<li>${escapeHtml(n)}</li>`).join('\n');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${CSP}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(text.title)}</title>
<style>${STYLE}</style>
</head>
<body>
<h1>${escapeHtml(text.title)}</h1>
${text.subtitle === undefined ? '' : `<p class="bt-subtitle">${escapeHtml(text.subtitle)}</p>\n`}${cautionBlock}<div id="bt-chart"></div>
${restList === '' ? '' : `<ul class="bt-notes">\n${restList}\n</ul>\n`}<script type="application/json" id="bt-chart-spec">${scriptJson(vegaSpec)}</script>
<script>${inlineScript(vegaCode)}</script>
<script>${CLIENT}</script>
</body>
</html>
`;
}
