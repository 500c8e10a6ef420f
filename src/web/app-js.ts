/**
 * @module web/app-js
 * The page's script, served at /app.js (the CSP allows only same-origin scripts, no inline code). It
 * enhances the plain form: shows only the chosen method's options, uploads with a progress bar, shows
 * the report inline and offers it as HTML, CSV and JSON downloads (Blob URLs, nothing re-uploaded).
 * Without it the form posts to /report and the server answers with the page and the report.
 * Plain ES2017 in a string (no build step), no template literals, no eval, no innerHTML of user text:
 * the only HTML inserted is the server's report, in which every user string is already escaped.
 */
export const APP_JS = `(function () {
  'use strict';
  var form = document.getElementById('assess-form');
  if (!form || !window.XMLHttpRequest || !window.FormData) return;
  var statusBox = document.getElementById('status');
  var statusText = document.getElementById('status-text');
  var progress = document.getElementById('progress');
  var errorBox = document.getElementById('form-error');
  var result = document.getElementById('result');
  var downloads = document.getElementById('downloads');
  var submit = document.getElementById('submit');
  var urls = [];

  function showMethodOptions() {
    var checked = form.querySelector('input[name=method]:checked');
    var kind = checked ? checked.value : 'open-air';
    var items = form.querySelectorAll('.method-only');
    for (var i = 0; i < items.length; i++) {
      var methods = (items[i].getAttribute('data-methods') || '').split(' ');
      items[i].hidden = methods.indexOf(kind) < 0;
    }
  }
  var radios = form.querySelectorAll('input[name=method]');
  for (var r = 0; r < radios.length; r++) radios[r].addEventListener('change', showMethodOptions);
  showMethodOptions();

  function setStatus(text, value) {
    statusBox.hidden = false;
    statusText.textContent = text;
    if (value === null) progress.removeAttribute('value'); else progress.value = value;
  }
  function showError(message, askQuestions) {
    errorBox.hidden = false;
    errorBox.textContent = '';
    var strong = document.createElement('strong');
    strong.textContent = 'Please check: ';
    errorBox.appendChild(strong);
    errorBox.appendChild(document.createTextNode(message));
    if (askQuestions) {
      var q = document.getElementById('file-questions');
      if (q) q.open = true;
      var tz = document.getElementById('f-utcOffset');
      if (tz) tz.focus();
    }
    errorBox.scrollIntoView({ block: 'center' });
  }
  function addDownload(label, text, type, name) {
    var url = URL.createObjectURL(new Blob([text], { type: type }));
    urls.push(url);
    var a = document.createElement('a');
    a.href = url;
    a.download = name;
    a.textContent = label;
    a.setAttribute('data-download', label.split(' ')[1] || label);
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
    addDownload('Report HTML', bundle.document, 'text/html;charset=utf-8', stem + '.html');
    addDownload('Tables CSV', bundle.csv, 'text/csv;charset=utf-8', stem + '.csv');
    addDownload('Assessment JSON', bundle.json, 'application/json', stem + '.json');
    downloads.hidden = false;
    // The report is server-rendered HTML with every user string escaped and no scripts.
    result.innerHTML = bundle.article;
    downloads.scrollIntoView({ block: 'start' });
  }

  form.addEventListener('submit', function (event) {
    var format = form.querySelector('[name=format]');
    if (format && format.value !== 'page') return; // file downloads: let the browser post the form
    event.preventDefault();
    errorBox.hidden = true;
    var data = new FormData(form);
    data.set('format', 'bundle');
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
      setStatus('Assessing the hours…', null);
      timer = setInterval(function () {
        setStatus('Assessing the hours… ' + Math.round((Date.now() - started) / 1000) + ' s', null);
      }, 1000);
    });
    function done() {
      if (timer) clearInterval(timer);
      submit.disabled = false;
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
        showError(body && body.detail ? body.detail : 'the server answered ' + xhr.status, !!(body && body.askFileQuestions));
      }
    });
    xhr.addEventListener('error', function () {
      done();
      statusBox.hidden = true;
      showError('the upload failed (network error); try again', false);
    });
    submit.disabled = true;
    setStatus('Uploading…', 0);
    xhr.send(data);
  });
})();
`
