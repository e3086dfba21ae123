// Specimen Ledger pages: the little that needs a script. Every page works without it except the upload
// progress and the live S0/L0 display. No inline code anywhere (the content security policy forbids it).
(function () {
  'use strict';

  function csrfHeaders() {
    var token = document.querySelector('meta[name="csrf-token"]');
    var header = document.querySelector('meta[name="csrf-header"]');
    var h = {};
    if (token && header) { h[header.content] = token.content; }
    return h;
  }

  // Show only the inputs that belong to the chosen shape and gauge-length basis.
  function showMatching(form, selectId, attribute) {
    var select = form.querySelector('#' + selectId);
    if (!select) { return; }
    var apply = function () {
      form.querySelectorAll('[' + attribute + ']').forEach(function (el) {
        el.hidden = el.getAttribute(attribute).split(' ').indexOf(select.value) < 0;
      });
    };
    select.addEventListener('change', apply);
    apply();
  }

  // S0 and L0 as the readings are typed, computed by the server's own geometry code.
  function geometryPreview(form) {
    var s0 = document.getElementById('s0-preview');
    var l0 = document.getElementById('l0-preview');
    var problem = document.getElementById('geometry-problem');
    var timer = null;
    var ask = function () {
      var body = new URLSearchParams(new FormData(form));
      fetch(form.dataset.preview, { method: 'POST', body: body, headers: csrfHeaders(), credentials: 'same-origin' })
        .then(function (r) { return r.ok ? r.json() : null; })
        .then(function (g) {
          if (!g) { return; }
          s0.textContent = g.s0 || '';
          l0.textContent = g.l0 || '';
          problem.hidden = !g.problem;
          problem.textContent = g.problem || '';
        })
        .catch(function () { /* the preview is a convenience; registration checks everything again */ });
    };
    form.addEventListener('input', function () { clearTimeout(timer); timer = setTimeout(ask, 250); });
    form.addEventListener('change', function () { clearTimeout(timer); timer = setTimeout(ask, 50); });
    ask();
  }

  // The curve goes as the request body so the browser can report upload progress.
  function curveUpload(form) {
    var input = form.querySelector('#curve-file');
    var bar = form.querySelector('#upload-progress');
    var status = form.querySelector('#upload-status');
    form.addEventListener('submit', function (event) {
      event.preventDefault();
      var file = input.files[0];
      if (!file) { status.textContent = 'Choose a file first.'; return; }
      var xhr = new XMLHttpRequest();
      xhr.open('PUT', form.action + '?filename=' + encodeURIComponent(file.name));
      var headers = csrfHeaders();
      Object.keys(headers).forEach(function (k) { xhr.setRequestHeader(k, headers[k]); });
      xhr.setRequestHeader('Content-Type', file.type || 'text/csv');
      xhr.setRequestHeader('Accept', 'application/json, application/problem+json');
      xhr.upload.addEventListener('progress', function (e) {
        if (e.lengthComputable) {
          bar.value = Math.round(e.loaded / e.total * 100);
          status.textContent = bar.value + ' % sent';
        }
      });
      xhr.upload.addEventListener('load', function () { bar.value = 100; status.textContent = 'Sent; analysing…'; });
      xhr.addEventListener('load', function () {
        var answer = null;
        try { answer = JSON.parse(xhr.responseText); } catch (e) { answer = null; }
        if (xhr.status >= 200 && xhr.status < 300 && answer && answer.result) {
          window.location.assign(answer.result);
          return;
        }
        var where = answer && answer.line ? ' (line ' + answer.line + (answer.column ? ', column ' + answer.column : '') + ')' : '';
        status.textContent = 'Refused: ' + ((answer && (answer.detail || answer.title)) || ('status ' + xhr.status)) + where;
        status.classList.add('bad');
      });
      xhr.addEventListener('error', function () { status.textContent = 'The upload failed; nothing was stored.'; });
      status.textContent = 'Sending…';
      xhr.send(file);
    });
  }

  // A job page: polls its progress until the job ends. The job runs on the server whether or not the page is open.
  function jobProgress(section) {
    var bar = document.getElementById('job-bar');
    var state = document.getElementById('job-state');
    var outcome = document.getElementById('job-outcome');
    var url = section.getAttribute('data-progress-url');
    function describe(job) {
      var verification = job.summary && job.summary.verification;
      if (verification) {
        return verification.valid ? '✓ chain intact: ' + verification.eventsChecked + ' events checked'
          : '✕ chain broken at event ' + verification.firstBrokenSeq + ': ' + verification.problem;
      }
      return job.failure || (job.succeeded + ' items succeeded, ' + job.failed + ' failed');
    }
    function poll() {
      var xhr = new XMLHttpRequest();
      xhr.open('GET', url);
      xhr.setRequestHeader('Accept', 'application/json, application/problem+json');
      xhr.addEventListener('load', function () {
        var job = null;
        try { job = JSON.parse(xhr.responseText); } catch (e) { job = null; }
        if (xhr.status !== 200 || !job) {
          state.textContent = 'Progress not available (status ' + xhr.status + '); reload the page to try again.';
          return;
        }
        bar.max = job.total > 0 ? job.total : 1;
        bar.value = job.done;
        state.textContent = job.state.toLowerCase() + ': ' + job.done + ' of ' + job.total + ' done, '
          + job.failed + ' failed';
        section.setAttribute('data-state', job.state);
        if (job.state === 'FINISHED' || job.state === 'FAILED') {
          outcome.textContent = describe(job);
        } else {
          window.setTimeout(poll, 700);
        }
      });
      xhr.addEventListener('error', function () { window.setTimeout(poll, 3000); });
      xhr.send();
    }
    poll();
  }

  document.addEventListener('DOMContentLoaded', function () {
    var job = document.getElementById('job-progress');
    if (job) { jobProgress(job); }
    var specimen = document.getElementById('specimen-form');
    if (specimen) {
      showMatching(specimen, 'shape', 'data-shapes');
      showMatching(specimen, 'basis', 'data-basis');
      geometryPreview(specimen);
    }
    var upload = document.getElementById('curve-upload');
    if (upload) { curveUpload(upload); }
  });
})();
