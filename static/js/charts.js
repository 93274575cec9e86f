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

  function drawAll(root) {
    if (!window.Plotly) return;
    var scope = root && root.querySelectorAll ? root : document;
    var els = Array.prototype.slice.call(scope.querySelectorAll('div.chart[data-chart]'));
    if (scope.matches && scope.matches('div.chart[data-chart]')) els.push(scope);
    els.forEach(function (el) {
      var src = document.getElementById(el.getAttribute('data-chart'));
      if (!src) return;
      var spec;
      try {
        spec = JSON.parse(src.textContent);
      } catch (e) {
        el.textContent = 'Chart data could not be read.';
        return;
      }
      window.Plotly.react(el, spec.data, spec.layout, CONFIG).then(function () {
        drawn += 1;
        el.setAttribute('data-drawn', String(drawn));
      });
    });
  }

  window.lockstepCharts = { drawAll: drawAll };
  if (window.htmx) window.htmx.onLoad(drawAll);
  else document.addEventListener('DOMContentLoaded', function () { drawAll(document); });
})();
