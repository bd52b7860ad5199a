// Plumbline's browser script. Loaded from /static (CSP: script-src 'self'); no inline code.
// Sends the page's CSRF token with every htmx request.
document.addEventListener('htmx:configRequest', (event) => {
  const meta = document.querySelector('meta[name="csrf-token"]');
  if (meta) event.detail.headers['x-csrf-token'] = meta.getAttribute('content');
});
