// Draws every chart on the page: each <div class="chart" data-chart="ID"> takes its plotly spec
// {data, layout} from <script type="application/json" id="ID">. Runs at load and after every htmx swap.
// Data only: nothing here turns text from the server into HTML or code.
(function () {
  'use strict';
  var drawn = 0;
  var CONFIG = {
    responsive: true,
    displaylogo: false,
    modeBarButtonsToRemove: ['select2d', 'lasso2d', 'autoScale2d'],
    toImageButtonOptions: { format: 'png', scale: 2 },
  };

  // htmx removes every <script> from a swapped answer (allowScriptTags: false, views/layout.ts), the JSON data
  // blocks too. So the data blocks of each answer are read from its text before the swap, with DOMParser (which
  // never runs anything), and kept here by id for the charts the swap brings in.
  var specs = {};
  document.addEventListener('htmx:beforeSwap', function (ev) {
    var text = ev.detail && ev.detail.serverResponse;
    if (typeof text !== 'string' || text.indexOf('application/json') < 0) return;
    var doc = new DOMParser().parseFromString('<body>' + text + '</body>', 'text/html');
    Array.prototype.forEach.call(doc.querySelectorAll('script[type="application/json"][id]'), function (s) {
      specs[s.id] = s.textContent;
    });
  });
  function specText(id) {
    var src = document.getElementById(id);
    if (src && src.tagName === 'SCRIPT') return src.textContent;
    return Object.prototype.hasOwnProperty.call(specs, id) ? specs[id] : null;
  }

  // A legend below the plot sits at a share of the plot height under it, so on a short plot, or when its rows
  // wrap on a narrow screen, it can run into the x-axis title. Measured after drawing: move it down by the
  // overlap and make the figure taller by as much (the plot keeps its height); at most a few rounds.
  function legendOverlap(el) {
    var legend = el.querySelector('g.legend');
    var title = el.querySelector('g.g-xtitle');
    if (!legend || !title) return 0;
    return title.getBoundingClientRect().bottom + 6 - legend.getBoundingClientRect().top;
  }
  function fitLegend(el, layout, rounds) {
    var over = legendOverlap(el);
    var size = el._fullLayout && el._fullLayout._size;
    if (over <= 0 || rounds <= 0 || !size || !(size.h > 0) || !layout.legend || typeof layout.legend.y !== 'number') return null;
    layout.legend.y -= over / size.h;
    layout.height = (layout.height || el.clientHeight) + Math.ceil(over);
    return window.Plotly.relayout(el, { 'legend.y': layout.legend.y, height: layout.height }).then(function () {
      return fitLegend(el, layout, rounds - 1);
    });
  }

  function fit(el) {
    if (el.lockstepFitting || !el.layout) return null;
    el.lockstepFitting = true;
    var done = function () { el.lockstepFitting = false; };
    return Promise.resolve(fitLegend(el, el.layout, 3)).then(done, done);
  }

  function drawAll(root) {
    if (!window.Plotly) return;
    var scope = root && root.querySelectorAll ? root : document;
    var els = Array.prototype.slice.call(scope.querySelectorAll('div.chart[data-chart]'));
    if (scope.matches && scope.matches('div.chart[data-chart]')) els.push(scope);
    els.forEach(function (el) {
      var text = specText(el.getAttribute('data-chart'));
      if (text === null) return;
      var spec;
      try {
        spec = JSON.parse(text);
      } catch (e) {
        el.textContent = 'Chart data could not be read.';
        return;
      }
      window.Plotly.react(el, spec.data, spec.layout, CONFIG)
        .then(function () {
          // again after every later redraw (a responsive resize can wrap the legend into more rows)
          if (!el.lockstepFits && el.on) {
            el.lockstepFits = true;
            el.on('plotly_afterplot', function () { fit(el); });
          }
          return fit(el);
        })
        .then(function () {
          drawn += 1;
          el.setAttribute('data-drawn', String(drawn));
        });
    });
  }

  window.lockstepCharts = { drawAll: drawAll };
  if (window.htmx) window.htmx.onLoad(drawAll);
  else document.addEventListener('DOMContentLoaded', function () { drawAll(document); });
})();
