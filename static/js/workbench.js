// Workbench behaviour that htmx attributes do not cover: keeping the draft in this browser (localStorage),
// restoring it after a reload, uploading and downloading files. No eval, no inline handlers (CSP).
(function () {
  'use strict';
  var KEY = 'lockstep.draft.v1';
  var form = document.getElementById('design-form');
  if (!form || !window.htmx) return;

  function pairs() {
    var out = [];
    new FormData(form).forEach(function (v, k) {
      if (typeof v === 'string') out.push([k, v]);
    });
    return out;
  }
  function lastValues(list) {
    var o = {};
    list.forEach(function (p) { o[p[0]] = p[1]; });
    return o;
  }
  function save() {
    try {
      localStorage.setItem(KEY, JSON.stringify({ saved: Date.now(), fields: pairs() }));
    } catch (e) { /* storage full or disabled: the page still works, the draft is not kept */ }
  }
  function fileMessage(text, bad) {
    var el = document.getElementById('file-msg');
    if (!el) {
      el = document.createElement('p');
      el.id = 'file-msg';
      el.setAttribute('role', 'status');
      document.querySelector('.top').appendChild(el);
    }
    el.className = bad ? 'file-msg bad' : 'file-msg';
    el.textContent = text;
  }

  // deferred result panels (views/pages/workbench.ts deferredSlot): a recompute replaces #results with
  // placeholders that load each panel for the new design when it is in view. Until the new answer arrives, the
  // panel's previous results stay inside the placeholder, dimmed and marked "not current" (CSS .deferred .stale),
  // so the page does not jump and nothing old is shown unmarked. Existing nodes are moved; no HTML is built here.
  document.body.addEventListener('htmx:oobBeforeSwap', function (ev) {
    var frag = ev.detail && ev.detail.fragment;
    if (!frag || !frag.querySelectorAll) return;
    Array.prototype.forEach.call(frag.querySelectorAll('.deferred[id]'), function (slot) {
      var old = document.getElementById(slot.id);
      var body = old && (old.querySelector(':scope > .deferred-body') || old.querySelector(':scope > .stale'));
      if (!body) return;
      body.classList.remove('deferred-body');
      body.classList.add('stale');
      body.setAttribute('aria-hidden', 'true');
      body.setAttribute('inert', '');
      Array.prototype.forEach.call(body.querySelectorAll('[id]'), function (el) { el.removeAttribute('id'); });
      slot.appendChild(body);
    });
  });

  // the axle-lift tool (views/axle-lift-view.ts) sits inside the results, which every recompute replaces: keep the
  // block as it is (typed readings, result) by moving the existing node into the new results before the swap
  document.body.addEventListener('htmx:oobBeforeSwap', function (ev) {
    var frag = ev.detail && ev.detail.fragment;
    if (!frag || !frag.querySelector) return;
    var fresh = frag.querySelector('#cg-lift');
    var old = document.getElementById('cg-lift');
    if (!fresh || !old || fresh === old) return;
    // fields still showing the design's figure follow the design; those typed over are kept as typed
    var was = {};
    var now = {};
    try { was = JSON.parse(old.getAttribute('data-design') || '{}'); now = JSON.parse(fresh.getAttribute('data-design') || '{}'); } catch (e) { was = {}; now = {}; }
    Object.keys(now).forEach(function (name) {
      var input = old.querySelector('input[name="' + name + '"]');
      if (input && (input.value === was[name] || input.value === '') && now[name] !== undefined) input.value = now[name];
    });
    old.setAttribute('data-design', fresh.getAttribute('data-design') || '{}');
    fresh.replaceWith(old);
  });

  var LIFT_KEY = 'lockstep.lift.v1';
  var FOLD_KEY = 'lockstep.folds.v1';

  // ---- "computing…": from the first keystroke (the form waits 400 ms before it posts) until the answer
  var live = document.getElementById('jb-live');
  function setLive(text, kind) {
    if (!live) return;
    live.textContent = text;
    live.className = 'jb-live ' + (kind || '');
  }
  function markComputing() {
    var st = document.getElementById('status');
    if (st && !st.classList.contains('computing')) {
      st.classList.add('computing');
      st.setAttribute('aria-busy', 'true');
      var p = document.createElement('p');
      p.className = 'busy';
      p.textContent = 'computing…';
      st.insertBefore(p, st.firstChild);
    }
    setLive('computing…', 'computing');
  }
  function showStatus() {
    var st = document.getElementById('status');
    if (!st || st.classList.contains('computing')) return;
    if (st.classList.contains('current')) setLive('Results are current', 'current');
    else {
      var first = st.querySelector('p');
      setLive(first ? first.textContent.replace(/\s+/g, ' ').trim() : 'Check input', 'invalid');
    }
  }
  form.addEventListener('input', function (ev) {
    // the axle-lift tool and the store's message field are not part of the design form's answer
    if (ev.target && ev.target.name && ev.target.name.charAt(0) !== '_' || (ev.target && ev.target.id === 'units')) markComputing();
  });
  document.body.addEventListener('htmx:beforeRequest', function (ev) {
    var t = ev.detail && ev.detail.target;
    if (t && t.id === 'status') markComputing();
  });
  document.body.addEventListener('htmx:afterSettle', showStatus);
  function notAnswered(ev) {
    var t = ev.detail && ev.detail.target;
    if (!t || t.id !== 'status') return;
    var st = document.getElementById('status');
    if (st) {
      st.classList.remove('computing');
      st.removeAttribute('aria-busy');
      var busy = st.querySelector('.busy');
      if (busy) busy.textContent = 'Not answered: the server could not be reached. Your inputs are kept; change a value to try again.';
    }
    setLive('Not answered', 'invalid');
  }
  document.body.addEventListener('htmx:sendError', notAnswered);
  document.body.addEventListener('htmx:timeout', notAnswered);
  showStatus();

  // ---- folded sections stay folded across the answers that replace them (kept in this browser)
  var closed = {};
  try { closed = JSON.parse(localStorage.getItem(FOLD_KEY) || '{}') || {}; } catch (e) { closed = {}; }
  function applyFolds(root) {
    if (!root || !root.querySelectorAll) return;
    var list = Array.prototype.slice.call(root.querySelectorAll('details.fold[data-fold]'));
    if (root.matches && root.matches('details.fold[data-fold]')) list.push(root);
    list.forEach(function (d) {
      if (closed[d.getAttribute('data-fold')]) d.removeAttribute('open');
    });
  }
  document.addEventListener('toggle', function (ev) {
    var d = ev.target;
    if (!d || !d.matches || !d.matches('details.fold[data-fold]')) return;
    var id = d.getAttribute('data-fold');
    if (d.open) delete closed[id];
    else closed[id] = 1;
    try { localStorage.setItem(FOLD_KEY, JSON.stringify(closed)); } catch (e) { /* ignore */ }
  }, true);
  document.body.addEventListener('htmx:oobBeforeSwap', function (ev) { applyFolds(ev.detail && ev.detail.fragment); });
  applyFolds(document);

  // ---- jumping to a section or a field opens the folded sections around it; the index closes after a pick
  function reveal(el) {
    for (var d = el.closest('details'); d; d = d.parentElement && d.parentElement.closest('details')) {
      if (!d.open && !d.classList.contains('jb-index')) d.open = true;
    }
  }
  document.addEventListener('click', function (ev) {
    var a = ev.target && ev.target.closest ? ev.target.closest('a[href^="#"]') : null;
    if (!a) return;
    var el = document.getElementById(decodeURIComponent(a.getAttribute('href').slice(1)));
    if (el) reveal(el);
    var idx = a.closest('.jb-index');
    if (idx) idx.open = false;
  });
  document.addEventListener('keydown', function (ev) {
    var idx = document.getElementById('section-index');
    if (ev.key === 'Escape' && idx && idx.open) idx.open = false;
  });

  // ---- tables reflow on a phone: each cell carries its column's heading (CSS shows it beside the value)
  function labelCells(root) {
    if (!root || !root.querySelectorAll) return;
    Array.prototype.forEach.call(root.querySelectorAll('table'), function (t) {
      var head = t.tHead && t.tHead.rows[0];
      if (!head) return;
      var names = [];
      Array.prototype.forEach.call(head.cells, function (c) {
        // innerText turns a <br> between a heading and its unit into a line break (textContent would join them)
        var text = (c.innerText || c.textContent).replace(/\s+/g, ' ').trim();
        for (var k = 0; k < (c.colSpan || 1); k++) names.push(text);
      });
      t.classList.add('reflow');
      Array.prototype.forEach.call(t.tBodies, function (tb) {
        Array.prototype.forEach.call(tb.rows, function (r) {
          var col = 0;
          Array.prototype.forEach.call(r.cells, function (c) {
            if (names[col] && !c.hasAttribute('data-label')) c.setAttribute('data-label', names[col]);
            col += c.colSpan || 1;
          });
        });
      });
    });
  }
  window.htmx.onLoad(labelCells);

  // ---- upload: a new design, or a new revision of a saved one? (asked only when designs are saved)
  function askUploadAs() {
    var dlg = document.getElementById('upload-ask');
    if (!dlg || !dlg.showModal) return Promise.resolve('');
    return window.htmx.ajax('GET', '/designs/choices', { target: '#upload-ask-design', swap: 'innerHTML' }).then(function () {
      var sel = document.getElementById('upload-ask-design');
      if (!sel || sel.options.length === 0) return '';
      return new Promise(function (resolve) {
        dlg.addEventListener('close', function onClose() {
          dlg.removeEventListener('close', onClose);
          if (dlg.returnValue !== 'load') return resolve(null);
          var rev = dlg.querySelector('input[name="upload_as"][value="revision"]');
          resolve(rev && rev.checked ? sel.value : '');
        });
        dlg.returnValue = '';
        dlg.showModal();
      });
    }, function () { return ''; });
  }

  // ---- the axle-lift tool: its readings are kept in this browser and come back after a reload
  function liftPairs() {
    var f = document.querySelector('#cg-lift form');
    if (!f) return null;
    var out = [];
    new FormData(f).forEach(function (v, k) { if (typeof v === 'string') out.push([k, v]); });
    return out;
  }
  function saveLift() {
    var p = liftPairs();
    if (!p) return;
    try { localStorage.setItem(LIFT_KEY, JSON.stringify({ saved: Date.now(), fields: p })); } catch (e) { /* ignore */ }
  }
  document.addEventListener('input', function (ev) { if (ev.target && ev.target.closest && ev.target.closest('#cg-lift')) saveLift(); });
  document.addEventListener('change', function (ev) { if (ev.target && ev.target.closest && ev.target.closest('#cg-lift')) saveLift(); });
  document.body.addEventListener('htmx:afterSettle', function (ev) { if (ev.detail && ev.detail.target && ev.detail.target.id === 'cg-lift') saveLift(); });
  function restoreLift() {
    var kept = null;
    try { kept = JSON.parse(localStorage.getItem(LIFT_KEY) || 'null'); } catch (e) { kept = null; }
    if (!kept || !Array.isArray(kept.fields) || !document.getElementById('cg-lift') || /[?&]fresh\b/.test(location.search)) return;
    var typed = kept.fields.some(function (p) { return /^lift\.(level|lifts)/.test(p[0]) && p[1] !== ''; });
    if (!typed) return;
    var values = lastValues(pairs());
    kept.fields.forEach(function (p) { values[p[0]] = p[1]; });
    values._lift_op = 'restore';
    window.htmx.ajax('POST', '/workbench/cg-lift', { target: '#cg-lift', swap: 'outerHTML', values: values });
  }

  form.addEventListener('input', save);
  form.addEventListener('change', save);
  document.body.addEventListener('htmx:afterSettle', save);

  // restore the draft kept in this browser (unless the page was opened with ?fresh)
  var restoring = false;
  var stored = null;
  try { stored = JSON.parse(localStorage.getItem(KEY) || 'null'); } catch (e) { stored = null; }
  if (stored && Array.isArray(stored.fields) && !/[?&]fresh\b/.test(location.search)) {
    var values = lastValues(stored.fields);
    var current = lastValues(pairs());
    var same = Object.keys(values).length === Object.keys(current).length &&
      Object.keys(values).every(function (k) { return k === '_shape' || values[k] === current[k]; });
    if (!same) {
      values._restore = '1';
      // the page opened on the demo: its results are not this design's, so they are hidden until the answer
      var res = document.getElementById('results');
      if (res) res.classList.add('restoring');
      restoring = true;
      window.htmx.ajax('POST', '/workbench/update', { target: '#status', swap: 'outerHTML', values: values }).then(function () {
        restoring = false;
        restoreLift();
      }, function () {
        restoring = false;
        var r = document.getElementById('results');
        if (r) r.classList.remove('restoring');
      });
    }
  }
  if (!restoring) restoreLift();

  // "Start again from the demo" (htmx asks first, hx-confirm) also forgets the draft, once confirmed
  document.body.addEventListener('htmx:beforeRequest', function (ev) {
    var elt = ev.detail && ev.detail.elt;
    if (elt && elt.closest && elt.closest('[data-reset-draft]')) {
      try { localStorage.removeItem(KEY); localStorage.removeItem(LIFT_KEY); } catch (e) { /* ignore */ }
    }
  });

  // upload: the file is read here and sent as the _upload field; the server validates it and either
  // replaces the inputs or lists the problems (the current design stays as it is)
  var upload = document.getElementById('upload');
  if (upload) {
    upload.addEventListener('change', function () {
      var f = upload.files && upload.files[0];
      if (!f) return;
      // the limit comes from the server (core/file-limits.ts), so the page and the server agree
      if (f.size > Number(upload.getAttribute('data-max-bytes'))) {
        fileMessage('That file is larger than ' + upload.getAttribute('data-max-text') + '; a design file is a few kilobytes. Nothing was changed.', true);
        upload.value = '';
        return;
      }
      f.text().then(function (text) {
        upload.value = '';
        return askUploadAs().then(function (designId) {
          if (designId === null) {
            fileMessage('Not loaded: ' + f.name + ' (cancelled). Nothing was changed.', false);
            return;
          }
          var units = (form.querySelector('[name="_units"]') || {}).value || 'metric';
          window.htmx.ajax('POST', '/workbench/update', { target: '#status', swap: 'outerHTML', values: { _upload: text, _units: units, _design_id: designId } });
          fileMessage('Loaded ' + f.name + (designId ? ' as a new revision of a saved design' : ' as a new design') + ' – see the status above the results.', false);
        });
      });
    });
  }

  // downloads: POST the current form, save the answer as a file. The message beside the button shows the
  // progress (preparing, then received so far) and is replaced by the outcome; one download per button at a time.
  function downloadMessage(b, text, bad) {
    var box = b.parentNode;
    var el = box.querySelector('.dl-msg');
    if (!el) {
      el = document.createElement('span');
      el.className = 'dl-msg';
      el.setAttribute('role', 'status');
      box.appendChild(el);
    }
    el.classList.toggle('bad', !!bad);
    el.textContent = text;
  }
  document.addEventListener('click', function (ev) {
    var b = ev.target && ev.target.closest ? ev.target.closest('button[data-download]') : null;
    if (!b) return;
    ev.preventDefault();
    if (b.getAttribute('aria-busy') === 'true') return;
    var name = b.getAttribute('data-filename') || 'the file';
    var started = Date.now();
    var received = 0;
    var total = 0;
    function progress() {
      var s = Math.round((Date.now() - started) / 1000);
      if (received === 0) downloadMessage(b, 'Preparing ' + name + '… ' + s + ' s');
      else downloadMessage(b, 'Downloading ' + name + '… ' + (total ? Math.min(100, Math.round((100 * received) / total)) + ' %' : Math.round(received / 1024) + ' KB'));
    }
    b.setAttribute('aria-busy', 'true');
    b.disabled = true;
    progress();
    var timer = setInterval(progress, 500);
    function done(text, bad) {
      clearInterval(timer);
      b.removeAttribute('aria-busy');
      b.disabled = false;
      downloadMessage(b, text, bad);
    }
    var body = new URLSearchParams();
    pairs().forEach(function (p) { body.append(p[0], p[1]); });
    fetch(b.getAttribute('data-download'), { method: 'POST', body: body, headers: { 'content-type': 'application/x-www-form-urlencoded' } })
      .then(function (res) {
        if (!res.ok) {
          return res.json().then(function (j) { done(j.message || 'Download refused.', true); }, function () { done('Download refused (' + res.status + ').', true); });
        }
        var cd = res.headers.get('content-disposition') || '';
        var m = /filename="([^"]+)"/.exec(cd);
        total = Number(res.headers.get('content-length')) || 0;
        var type = res.headers.get('content-type') || 'application/octet-stream';
        var chunks = [];
        var reader = res.body && res.body.getReader ? res.body.getReader() : null;
        function pump() {
          if (!reader) return res.blob().then(function (bl) { chunks.push(bl); });
          return reader.read().then(function (r) {
            if (r.done) return null;
            chunks.push(r.value);
            received += r.value.length;
            progress();
            return pump();
          });
        }
        return pump().then(function () {
          var blob = new Blob(chunks, { type: type });
          var a = document.createElement('a');
          a.href = URL.createObjectURL(blob);
          a.download = m ? m[1] : b.getAttribute('data-filename') || 'lockstep-download';
          document.body.appendChild(a);
          a.click();
          setTimeout(function () { URL.revokeObjectURL(a.href); a.remove(); }, 1000);
          done('Downloaded ' + a.download + ' (' + Math.max(1, Math.round(blob.size / 1024)) + ' KB).', false);
        });
      })
      .catch(function () { done('Download failed: the server did not answer.', true); });
  });
})();
