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

  // The plot area (inside the axes) keeps at least MIN_PLOT px on a desktop, MIN_PLOT_NARROW on a phone, however
  // much the axis titles, tick labels and a wrapped title took from the figure: the figure grows by the shortfall.
  var MIN_PLOT = 320;
  var MIN_PLOT_NARROW = 240;
  function fitPlot(el, layout, rounds) {
    var size = el._fullLayout && el._fullLayout._size;
    if (!size || !(size.h > 0) || rounds <= 0) return null;
    var min = window.innerWidth > 600 ? MIN_PLOT : MIN_PLOT_NARROW;
    if (size.h >= min - 0.5) return null;
    // a legend below the plot sits at a share of the plot height, so part of the added height goes to it
    layout.height = (layout.height || el.clientHeight) + Math.ceil(1.4 * (min - size.h));
    return window.Plotly.relayout(el, { height: layout.height }).then(function () { return fitPlot(el, layout, rounds - 1); });
  }

  function fit(el) {
    if (el.lockstepFitting || !el.layout) return null;
    el.lockstepFitting = true;
    var done = function () { el.lockstepFitting = false; };
    return Promise.resolve(fitLegend(el, el.layout, 3)).then(function () { return fitPlot(el, el.layout, 4); }).then(done, done);
  }

  // On a narrow screen a long chart title is broken over two lines (plotly's own line break) with room above
  // the plot for it, so it never runs under the mode bar or out of the figure.
  function fitTitle(spec, width) {
    var t = spec.layout && spec.layout.title;
    if (!t || typeof t.text !== 'string' || t.text.indexOf('<br>') >= 0) return;
    if (t.text.length * 7.4 < width - 40) return;
    var mid = Math.floor(t.text.length / 2);
    var cut = t.text.lastIndexOf(' ', mid + 8);
    if (cut <= 0) return;
    t.text = t.text.slice(0, cut) + '<br>' + t.text.slice(cut + 1);
    var m = spec.layout.margin || (spec.layout.margin = {});
    m.t = (m.t || 40) + 18;
    spec.layout.height = (spec.layout.height || 420) + 18;
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
      fitTitle(spec, el.clientWidth || window.innerWidth);
      // on a phone the mode bar would sit over the title; zooming by touch still works without it
      var config = window.innerWidth > 600 ? CONFIG : Object.assign({}, CONFIG, { displayModeBar: false });
      window.Plotly.react(el, spec.data, spec.layout, config)
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
