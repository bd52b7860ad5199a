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

// Ranking by drag: dragging a candidate above or below another reorders the list and renumbers
// the ranks 1…K in the new order. Ranks stay editable (digits, arrow keys) in the number fields.
function renumber(list) {
  list.querySelectorAll('li.candidate').forEach((li, i) => {
    const input = li.querySelector('input.rank');
    if (input) input.value = String(i + 1);
  });
}
function enableDrag(list) {
  let dragged = null;
  list.querySelectorAll('li.candidate').forEach((li) => {
    li.setAttribute('draggable', 'true');
    li.addEventListener('dragstart', (event) => {
      dragged = li;
      li.classList.add('dragging');
      event.dataTransfer.effectAllowed = 'move';
      event.dataTransfer.setData('text/plain', li.dataset.response || '');
    });
    li.addEventListener('dragend', () => {
      li.classList.remove('dragging');
      dragged = null;
    });
    li.addEventListener('dragover', (event) => {
      if (!dragged || dragged === li) return;
      event.preventDefault();
      const box = li.getBoundingClientRect();
      const before = event.clientY < box.top + box.height / 2;
      list.insertBefore(dragged, before ? li : li.nextSibling);
    });
    li.addEventListener('drop', (event) => {
      event.preventDefault();
      renumber(list);
    });
  });
}
document.addEventListener('DOMContentLoaded', () => {
  const list = document.querySelector('form.ranking-form ol.candidates');
  if (list) enableDrag(list);
});
