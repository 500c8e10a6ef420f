/**
 * @module web/app-js
 * The page's script, served at /app.js (the CSP allows only same-origin scripts, no inline code). It
 * enhances every job's plain form: shows only the chosen methods' options, adds rows to the sites table,
 * uploads with a progress bar in a live region, shows the result inline (focus moves to its heading, so a
 * screen reader reads it) and offers it as downloads (Blob URLs, nothing re-uploaded), puts a failed field's
 * message next to it and moves the focus there, and prints the two-page summary alone. Without it the forms
 * post to /report and the server answers with the page and the result.
 * Plain ES2017 in a string (no build step), no template literals, no eval, no innerHTML of user text:
 * the only HTML inserted is the server's result, in which every user string is already escaped.
 */
export const APP_JS = `(function () {
  'use strict';
  var form = document.querySelector('form.task-form');
  if (!form || !window.XMLHttpRequest || !window.FormData) return;
  document.documentElement.className += ' js';
  var statusBox = document.getElementById('status');
  var statusText = document.getElementById('status-text');
  var progress = document.getElementById('progress');
  var errorBox = document.getElementById('form-error');
  var result = document.getElementById('result');
  var downloads = document.getElementById('downloads');
  var submitButtons = form.querySelectorAll('button[type=submit]');
  var urls = [];
  var submitter = null;

  function showMethodOptions() {
    var checked = form.querySelectorAll('input[name=method]:checked');
    var kinds = [];
    for (var c = 0; c < checked.length; c++) kinds.push(checked[c].value);
    if (kinds.length === 0) kinds.push('open-air');
    var items = form.querySelectorAll('.method-only');
    for (var i = 0; i < items.length; i++) {
      var methods = (items[i].getAttribute('data-methods') || '').split(' ');
      var show = false;
      for (var k = 0; k < kinds.length; k++) if (methods.indexOf(kinds[k]) >= 0) show = true;
      items[i].hidden = !show;
    }
  }
  var methodInputs = form.querySelectorAll('input[name=method]');
  for (var r = 0; r < methodInputs.length; r++) methodInputs[r].addEventListener('change', showMethodOptions);
  showMethodOptions();

  // The sites table: a new row is a copy of the last one with the next number, empty.
  var sites = document.getElementById('sites');
  var addSite = document.getElementById('add-site');
  function siteCount() { return sites ? sites.querySelectorAll('fieldset.site').length : 0; }
  function updateAddSite() {
    if (!addSite || !sites) return;
    var max = Number(sites.getAttribute('data-max') || '8');
    addSite.disabled = siteCount() >= max;
    addSite.textContent = addSite.disabled ? 'At most ' + max + ' sites' : 'Add a site';
  }
  if (addSite && sites) {
    addSite.addEventListener('click', function () {
      var rows = sites.querySelectorAll('fieldset.site');
      var last = rows[rows.length - 1];
      var n = rows.length + 1;
      var copy = last.cloneNode(true);
      copy.setAttribute('data-site', String(n));
      var legendEl = copy.querySelector('legend');
      if (legendEl) legendEl.textContent = 'Site ' + n + ' (optional)';
      var fields = copy.querySelectorAll('input, label');
      for (var i = 0; i < fields.length; i++) {
        var el = fields[i];
        var from = 'site' + (n - 1);
        var to = 'site' + n;
        if (el.name) el.name = el.name.replace(from + '.', to + '.');
        if (el.id) el.id = el.id.replace('f-' + from + '-', 'f-' + to + '-');
        var forId = el.getAttribute('for');
        if (forId) el.setAttribute('for', forId.replace('f-' + from + '-', 'f-' + to + '-'));
        if (el.tagName === 'INPUT') { el.value = ''; el.removeAttribute('aria-invalid'); }
      }
      sites.appendChild(copy);
      updateAddSite();
      var first = copy.querySelector('input');
      if (first) first.focus();
    });
    updateAddSite();
  }

  function setStatus(text, value) {
    statusBox.hidden = false;
    statusText.textContent = text;
    if (value === null) progress.removeAttribute('value'); else progress.value = value;
  }
  function clearInvalid() {
    var marked = form.querySelectorAll('[aria-invalid=true]');
    for (var i = 0; i < marked.length; i++) marked[i].removeAttribute('aria-invalid');
  }
  function showError(message, askQuestions, field) {
    errorBox.hidden = false;
    errorBox.textContent = '';
    var strong = document.createElement('strong');
    strong.textContent = 'Please check: ';
    errorBox.appendChild(strong);
    errorBox.appendChild(document.createTextNode(message));
    var target = null;
    if (field) target = form.querySelector('[name="' + field.replace(/"/g, '') + '"]');
    if (askQuestions) {
      var q = document.getElementById('file-questions');
      if (q) q.open = true;
      if (!target) target = document.getElementById('f-utcOffset');
    }
    if (target) {
      var details = target.closest ? target.closest('details') : null;
      if (details) details.open = true;
      target.setAttribute('aria-invalid', 'true');
      if (errorBox.id) target.setAttribute('aria-errormessage', errorBox.id);
      target.focus();
    } else {
      errorBox.focus();
    }
    errorBox.scrollIntoView({ block: 'center' });
  }
  function addDownload(label, text, type, name) {
    if (typeof text !== 'string') return;
    var url = URL.createObjectURL(new Blob([text], { type: type }));
    urls.push(url);
    var a = document.createElement('a');
    a.href = url;
    a.download = name;
    a.textContent = label;
    downloads.appendChild(a);
  }
  function showResult(bundle) {
    for (var i = 0; i < urls.length; i++) URL.revokeObjectURL(urls[i]);
    urls = [];
    downloads.textContent = '';
    var title = document.createElement('strong');
    title.textContent = 'Download: ';
    downloads.appendChild(title);
    var stem = bundle.stem || 'dryhours-report';
    addDownload('Summary to print (HTML)', bundle.handout, 'text/html;charset=utf-8', stem + '-summary.html');
    addDownload('Full report (HTML)', bundle.document, 'text/html;charset=utf-8', stem + '.html');
    addDownload('Tables (CSV)', bundle.csv, 'text/csv;charset=utf-8', stem + '.csv');
    addDownload('Numbers (JSON)', bundle.json, 'application/json', stem + '.json');
    if (bundle.handout) {
      var print = document.createElement('button');
      print.type = 'button';
      print.className = 'secondary';
      print.textContent = 'Print the two-page summary';
      print.addEventListener('click', function () {
        document.body.classList.add('print-handout');
        window.print();
      });
      downloads.appendChild(print);
    }
    downloads.hidden = false;
    // The result is server-rendered HTML with every user string escaped and no scripts.
    result.innerHTML = bundle.article;
    var heading = result.querySelector('h1');
    if (heading) {
      if (!heading.hasAttribute('tabindex')) heading.setAttribute('tabindex', '-1');
      heading.focus();
    } else result.focus();
  }
  window.addEventListener('afterprint', function () { document.body.classList.remove('print-handout'); });

  form.addEventListener('click', function (event) {
    var t = event.target;
    if (t && t.tagName === 'BUTTON' && t.type === 'submit') submitter = t;
  });
  form.addEventListener('submit', function (event) {
    var format = form.querySelector('[name=format]');
    var by = event.submitter || submitter;
    var task = by && by.name === 'task' ? by.value : null;
    if (format && format.value !== 'page' && !task) return; // file downloads: let the browser post the form
    event.preventDefault();
    errorBox.hidden = true;
    clearInvalid();
    var data = new FormData(form);
    if (task) data.append('task', task);
    data.set('format', 'bundle');
    submitter = null;
    var xhr = new XMLHttpRequest();
    var started = Date.now();
    var timer = null;
    xhr.open('POST', '/report');
    xhr.setRequestHeader('accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.addEventListener('progress', function (e) {
      if (e.lengthComputable) setStatus('Uploading ' + Math.round((100 * e.loaded) / e.total) + ' %', Math.round((100 * e.loaded) / e.total));
    });
    xhr.upload.addEventListener('load', function () {
      setStatus('Working on it…', null);
      timer = setInterval(function () {
        setStatus('Working on it… ' + Math.round((Date.now() - started) / 1000) + ' s', null);
      }, 5000);
    });
    function done() {
      if (timer) clearInterval(timer);
      for (var b = 0; b < submitButtons.length; b++) submitButtons[b].disabled = false;
    }
    xhr.addEventListener('load', function () {
      done();
      var body = null;
      try { body = JSON.parse(xhr.responseText); } catch (e) { body = null; }
      if (xhr.status === 200 && body && typeof body.article === 'string') {
        setStatus('Done in ' + ((Date.now() - started) / 1000).toFixed(1) + ' s', 100);
        showResult(body);
      } else {
        statusBox.hidden = true;
        showError(body && body.detail ? body.detail : 'the server answered ' + xhr.status, !!(body && body.askFileQuestions), body && body.field);
      }
    });
    xhr.addEventListener('error', function () {
      done();
      statusBox.hidden = true;
      showError('the upload failed (network error); try again', false, null);
    });
    for (var b = 0; b < submitButtons.length; b++) submitButtons[b].disabled = true;
    setStatus('Uploading…', 0);
    xhr.send(data);
  });
})();
`
