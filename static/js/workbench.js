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
    if (fresh && old && fresh !== old) fresh.replaceWith(old);
  });

  form.addEventListener('input', save);
  form.addEventListener('change', save);
  document.body.addEventListener('htmx:afterSettle', save);

  // restore the draft kept in this browser (unless the page was opened with ?fresh)
  var stored = null;
  try { stored = JSON.parse(localStorage.getItem(KEY) || 'null'); } catch (e) { stored = null; }
  if (stored && Array.isArray(stored.fields) && !/[?&]fresh\b/.test(location.search)) {
    var values = lastValues(stored.fields);
    var current = lastValues(pairs());
    var same = Object.keys(values).length === Object.keys(current).length &&
      Object.keys(values).every(function (k) { return k === '_shape' || values[k] === current[k]; });
    if (!same) {
      values._restore = '1';
      window.htmx.ajax('POST', '/workbench/update', { target: '#status', swap: 'outerHTML', values: values });
    }
  }

  // "Start again from the demo" also forgets the draft
  document.addEventListener('click', function (ev) {
    var t = ev.target;
    if (t && t.closest && t.closest('[data-reset-draft]')) {
      try { localStorage.removeItem(KEY); } catch (e) { /* ignore */ }
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
        var units = (form.querySelector('[name="_units"]') || {}).value || 'metric';
        window.htmx.ajax('POST', '/workbench/update', { target: '#status', swap: 'outerHTML', values: { _upload: text, _units: units } });
        fileMessage('Loaded ' + f.name + ' – see the status above the results.', false);
        upload.value = '';
      });
    });
  }

  // downloads: POST the current form, save the answer as a file
  document.addEventListener('click', function (ev) {
    var b = ev.target && ev.target.closest ? ev.target.closest('button[data-download]') : null;
    if (!b) return;
    ev.preventDefault();
    var body = new URLSearchParams();
    pairs().forEach(function (p) { body.append(p[0], p[1]); });
    fetch(b.getAttribute('data-download'), { method: 'POST', body: body, headers: { 'content-type': 'application/x-www-form-urlencoded' } })
      .then(function (res) {
        if (!res.ok) {
          return res.json().then(function (j) { fileMessage(j.message || 'Download refused.', true); });
        }
        var cd = res.headers.get('content-disposition') || '';
        var m = /filename="([^"]+)"/.exec(cd);
        return res.blob().then(function (blob) {
          var a = document.createElement('a');
          a.href = URL.createObjectURL(blob);
          a.download = m ? m[1] : b.getAttribute('data-filename') || 'lockstep-download';
          document.body.appendChild(a);
          a.click();
          setTimeout(function () { URL.revokeObjectURL(a.href); a.remove(); }, 1000);
          fileMessage('Downloaded ' + a.download + '.', false);
        });
      })
      .catch(function () { fileMessage('Download failed: the server did not answer.', true); });
  });
})();
