// seedsift: make the server-drawn charts interactive when JavaScript runs.
// Each chart figure holds its SVG (drawn when the report was written) and its compiled Vega spec
// as JSON. When a chart comes near the screen, a Vega view is built from the spec, drawn
// off-screen, and swapped in for the SVG once it has rendered, so the page never shows an empty
// chart; if anything fails, the SVG stays. `data-live` on the chart says which: pending, true, failed.
// Expressions are evaluated by Vega's interpreter (the global vegaInterpreter, inlined before this
// script) from the parsed syntax trees, never compiled with eval or Function: the page's
// Content-Security-Policy allows neither. Legend clicks are the charts' own (Vega-Lite selections):
// a click shows that config alone, shift-click adds or removes one, a double-click shows all.
// Tooltips use a small handler of our own that writes text only (never HTML). Nothing here reaches
// the network: the Content-Security-Policy forbids it.
(function () {
  'use strict';

  var tip = null;

  function tooltipElement() {
    if (tip === null) {
      tip = document.createElement('div');
      tip.className = 'chart-tip';
      tip.setAttribute('role', 'tooltip');
      tip.hidden = true;
      document.body.appendChild(tip);
    }
    return tip;
  }

  function show(text) {
    return text === null || text === undefined ? '' : String(text);
  }

  // Vega calls handler(handler, event, item, value); value is the mark's tooltip (object or text).
  function tooltip(handler, event, item, value) {
    var el = tooltipElement();
    if (value === null || value === undefined || value === '') {
      el.hidden = true;
      return;
    }
    while (el.firstChild) el.removeChild(el.firstChild);
    if (typeof value === 'object') {
      var table = document.createElement('table');
      Object.keys(value).forEach(function (key) {
        var row = table.insertRow();
        var th = document.createElement('th');
        th.textContent = key;
        row.appendChild(th);
        row.insertCell().textContent = show(value[key]);
      });
      el.appendChild(table);
    } else {
      el.textContent = show(value);
    }
    el.hidden = false;
    var x = event.clientX + 14;
    var y = event.clientY + 14;
    var box = el.getBoundingClientRect();
    if (x + box.width > window.innerWidth - 8) x = Math.max(8, event.clientX - box.width - 14);
    if (y + box.height > window.innerHeight - 8) y = Math.max(8, event.clientY - box.height - 14);
    el.style.left = x + 'px';
    el.style.top = y + 'px';
  }

  function hydrate(view) {
    var script = view.parentNode && view.parentNode.querySelector('script.chart-spec');
    if (!script) return;
    var spec;
    try {
      spec = JSON.parse(script.textContent);
    } catch (e) {
      view.setAttribute('data-live', 'failed');
      return;
    }
    var holder = document.createElement('div');
    holder.className = 'chart-live';
    var runtime = vega.parse(spec, null, { ast: true });
    var live = new vega.View(runtime, { expr: vegaInterpreter, renderer: 'svg', logLevel: vega.Error });
    live.tooltip(tooltip);
    live.hover();
    live.initialize(holder);
    live.runAsync().then(
      function () {
        while (view.firstChild) view.removeChild(view.firstChild);
        view.appendChild(holder);
        view.setAttribute('data-live', 'true');
        keyboardLegend(holder);
      },
      function () {
        live.finalize();
        view.setAttribute('data-live', 'failed');
      }
    );
  }

  // Legends usable by keyboard: each legend label of a live chart can take focus, and Enter or
  // Space acts as a click on it (a shift-click with Shift held), which Vega handles as its own.
  function keyboardLegend(holder) {
    var labels = holder.querySelectorAll('.role-legend-label text');
    for (var i = 0; i < labels.length; i++) {
      var label = labels[i];
      label.setAttribute('tabindex', '0');
      label.setAttribute('role', 'button');
      label.setAttribute('aria-label', 'show ' + label.textContent + ' alone (Shift: add or remove)');
      label.addEventListener('keydown', function (event) {
        if (event.key !== 'Enter' && event.key !== ' ') return;
        event.preventDefault();
        var box = event.target.getBoundingClientRect();
        var init = {
          bubbles: true,
          cancelable: true,
          shiftKey: event.shiftKey,
          clientX: box.left + box.width / 2,
          clientY: box.top + box.height / 2,
        };
        event.target.dispatchEvent(new MouseEvent('click', init));
      });
    }
  }

  // A link into a folded section opens the section, so the contents reach every heading.
  function openTarget() {
    var id = decodeURIComponent(location.hash.slice(1));
    var target = id === '' ? null : document.getElementById(id);
    for (var node = target; node !== null; node = node.parentElement) {
      if (node.tagName === 'DETAILS') node.open = true;
    }
    if (target !== null) target.scrollIntoView();
  }
  window.addEventListener('hashchange', openTarget);

  function hydrateSafely(view) {
    if (view.hasAttribute('data-live')) return;
    view.setAttribute('data-live', 'pending');
    try {
      hydrate(view);
    } catch (e) {
      view.setAttribute('data-live', 'failed');
    }
  }

  // Charts become interactive as they come near the screen, so opening a long report stays quick.
  function start() {
    if (typeof vega === 'undefined' || typeof vegaInterpreter === 'undefined') return;
    var views = document.querySelectorAll('.chart-view[data-chart]');
    var i;
    if (!('IntersectionObserver' in window)) {
      for (i = 0; i < views.length; i++) hydrateSafely(views[i]);
      return;
    }
    var watcher = new IntersectionObserver(function (entries) {
      entries.forEach(function (entry) {
        if (!entry.isIntersecting) return;
        watcher.unobserve(entry.target);
        hydrateSafely(entry.target);
      });
    }, { rootMargin: '400px 0px' });
    for (i = 0; i < views.length; i++) watcher.observe(views[i]);
    document.addEventListener('scroll', function () {
      if (tip !== null) tip.hidden = true;
    }, { passive: true });
  }

  // Printing shows folded sections in full.
  window.addEventListener('beforeprint', function () {
    var folds = document.querySelectorAll('details');
    for (var i = 0; i < folds.length; i++) folds[i].open = true;
  });

  function ready() {
    start();
    if (location.hash !== '') openTarget();
  }

  if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', ready);
  else ready();
})();
