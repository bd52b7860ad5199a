// Plumbline's browser script. Loaded from /static (CSP: script-src 'self'); no inline code.
// Sends the page's CSRF token with every htmx request.
document.addEventListener('htmx:configRequest', (event) => {
  const meta = document.querySelector('meta[name="csrf-token"]');
  if (meta) event.detail.headers['x-csrf-token'] = meta.getAttribute('content');
});

// Reviewer care: passages from critical criteria are hidden until the reviewer chooses to see them;
// showing one is recorded.
function showMasked(span) {
  if (span.dataset.masked !== 'true') return;
  span.dataset.masked = 'false';
  span.querySelector('.mask-label').hidden = true;
  span.querySelector('.mask-body').hidden = false;
  const form = document.querySelector('form.ranking-form');
  const meta = document.querySelector('meta[name="csrf-token"]');
  if (form && meta) {
    fetch(form.action.replace(/\/(reveal|submit)$/, '/unmask'), { method: 'POST', headers: { 'x-csrf-token': meta.getAttribute('content') } });
  }
}
document.addEventListener('click', (event) => {
  const span = event.target.closest && event.target.closest('.finding.masked');
  if (span) showMasked(span);
});
document.addEventListener('keydown', (event) => {
  if (event.key !== 'Enter' && event.key !== ' ') return;
  const span = event.target.closest && event.target.closest('.finding.masked');
  if (span) {
    event.preventDefault();
    showMasked(span);
  }
});
