// The list page: every ensemble from GET /ensembles (the API the CLI uses),
// polled every 2 s, with a live chart of particles per second.
import { bar, el, fmtDuration, fmtInt, fmtRate, getJson, POLL_MS, stateBadge } from './common.js';
import { colourOf, drawChart } from './chart.js';

const history = new Map(); // id -> { name, points: [{t, v}] }

function row(s) {
  const tr = el('tr', { 'data-id': s.id, 'data-state': s.state, 'data-particles-done': String(s.particles.done) });
  const name = el('td');
  name.append(el('a', { href: `/view/${encodeURIComponent(s.id)}`, text: s.name || s.id }), el('div', { class: 'muted', text: s.id }));
  const fails = el('td', { class: s.failures.length || s.runs.failed ? 'failures' : 'muted' });
  fails.textContent = s.runs.failed ? `${s.runs.failed} run(s) failed` : 'none';
  if (s.failures.length) fails.title = s.failures.map((f) => `run ${f.runIndex}: ${f.reason}`).join('\n');
  const progress = el('td');
  progress.append(bar(s.particles.done, s.particles.total, `${fmtInt(s.particles.done)} / ${fmtInt(s.particles.total)} particles`));
  tr.append(
    name,
    el('td', {}, stateBadge(s.state)),
    progress,
    el('td', { class: 'num', text: `${s.runs.done} / ${s.runs.planned}` }),
    el('td', { class: 'num', text: s.state === 'running' ? fmtRate(s.throughput) : '–' }),
    el('td', { class: 'num', text: s.state === 'running' ? fmtDuration(s.etaSeconds) : '–' }),
    fails,
  );
  return tr;
}

async function poll() {
  const err = document.getElementById('error');
  try {
    const { ensembles } = await getJson('/ensembles');
    const now = Date.now();
    for (const s of ensembles) {
      if (s.state !== 'running' && !history.has(s.id)) continue;
      const h = history.get(s.id) ?? { name: s.name || s.id, points: [] };
      h.points.push({ t: now, v: s.state === 'running' ? s.throughput : 0 });
      while (h.points.length > 400) h.points.shift();
      history.set(s.id, h);
    }
    const body = document.querySelector('#ensembles tbody');
    body.replaceChildren(...ensembles.map(row));
    document.getElementById('empty').hidden = ensembles.length > 0;
    const series = [...history.values()].map((h) => ({ label: h.name, points: h.points }));
    drawChart(document.getElementById('chart'), series, { now });
    document.getElementById('legend').replaceChildren(...series.map((s, i) => {
      const swatch = el('i');
      swatch.style.background = colourOf(i);
      return el('span', {}, swatch, s.label);
    }));
    // sweeps: one link each to their page (their members are rows above)
    const { sweeps } = await getJson('/sweeps');
    document.getElementById('sweeps-card').hidden = sweeps.length === 0;
    document.getElementById('sweeps').replaceChildren(...sweeps.map((sw) => {
      const li = el('li', { 'data-id': sw.id, 'data-state': sw.state });
      li.append(el('a', { href: `/sweep/${encodeURIComponent(sw.id)}`, text: sw.name || sw.id }), ` ${sw.parameter} = ${sw.values.join(', ')} `, stateBadge(sw.state), ` ${sw.runs.done} / ${sw.runs.planned} runs`);
      return li;
    }));
    document.getElementById('updated').textContent = `last update ${new Date(now).toLocaleTimeString()}`;
    err.hidden = true;
  } catch (e) {
    err.hidden = false;
    err.textContent = `cannot read /ensembles: ${e.message}`;
  }
}

poll();
setInterval(poll, POLL_MS);
