// The page of one sweep: GET /sweeps/ID (totals and members, polled every
// 2 s) and its D(parameter) figure, reloaded when a member finishes runs.
import { bar, el, fmtDuration, fmtInt, fmtRate, getJson, POLL_MS, stateBadge } from './common.js';

const id = decodeURIComponent(location.pathname.split('/').pop());
let shownDone = -1;

async function poll() {
  const err = document.getElementById('error');
  try {
    const s = await getJson(`/sweeps/${encodeURIComponent(id)}`);
    document.getElementById('title').textContent = s.name || s.id;
    document.getElementById('sweep-id').textContent = `${s.id}: ${s.parameter} = ${s.values.join(', ')}`;
    document.getElementById('state').replaceChildren(stateBadge(s.state));
    document.getElementById('particles-bar').replaceChildren(bar(s.particles.done, s.particles.total, `${fmtInt(s.particles.done)} / ${fmtInt(s.particles.total)} particles`));
    document.getElementById('runs').textContent = `${s.runs.done} / ${s.runs.planned} done, ${s.runs.running} running, ${s.runs.failed} failed`;
    document.getElementById('throughput').textContent = s.state === 'running' ? fmtRate(s.throughput) : '–';
    document.getElementById('eta').textContent = s.state === 'running' ? fmtDuration(s.etaSeconds) : '–';
    document.getElementById('parameter').textContent = s.parameter;
    const rows = s.members.map((m) => {
      const st = m.status;
      const tr = el('tr', { 'data-value': String(m.value), 'data-state': st ? st.state : 'missing' });
      const link = el('td');
      if (st) link.append(el('a', { href: `/view/${encodeURIComponent(st.id)}`, text: st.id }));
      const progress = el('td');
      if (st) progress.append(bar(st.particles.done, st.particles.total, `${fmtInt(st.particles.done)} / ${fmtInt(st.particles.total)}`));
      tr.append(el('td', { class: 'num', text: String(m.value) }), link, el('td', {}, st ? stateBadge(st.state) : 'missing'), progress, el('td', { class: 'num', text: st ? `${st.runs.done} / ${st.runs.planned}` : '–' }));
      return tr;
    });
    document.querySelector('#members tbody').replaceChildren(...rows);
    const base = `/sweeps/${encodeURIComponent(id)}`;
    document.getElementById('json').href = `${base}/summary?format=json`;
    document.getElementById('csv').href = `${base}/summary?format=csv`;
    if (s.runs.done !== shownDone) {
      shownDone = s.runs.done;
      document.getElementById('figure').src = `${base}/figure.svg?done=${s.runs.done}`;
    }
    err.hidden = true;
    if (s.state === 'running') setTimeout(poll, POLL_MS);
  } catch (e) {
    err.textContent = e.message;
    err.hidden = false;
    setTimeout(poll, POLL_MS * 2);
  }
}
poll();
