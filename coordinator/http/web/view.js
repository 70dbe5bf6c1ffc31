// One ensemble: GET /ensembles/ID (the API the CLI uses) every 2 s, the
// report figures when the count of finished clusters changes, run 0's
// picture, summary downloads and a cancel button that sends the API token.
import { bar, el, fmtDuration, fmtInt, fmtRate, getJson, POLL_MS, richText, stateBadge } from './common.js';
import { drawChart } from './chart.js';

const id = decodeURIComponent(location.pathname.split('/').pop());
const api = `/ensembles/${encodeURIComponent(id)}`;
const points = [];
let figuresKey = null;
let shownClusters = -1;
let pictureShown = false;
let pictureBusy = false;
let polling = false;

function showError(msg) {
  const e = document.getElementById('error');
  e.hidden = !msg;
  e.textContent = msg ?? '';
}

function downloads() {
  const p = document.getElementById('downloads');
  const links = [
    ['summary.json', `${api}/summary?format=json`],
    ['series.csv', `${api}/summary?format=csv&table=series`],
    ['runs.csv', `${api}/summary?format=csv&table=runs`],
    ['estimators.csv', `${api}/summary?format=csv&table=estimators`],
    ['summary.pb (protobuf)', `${api}/summary?format=pb`],
  ];
  p.replaceChildren(...links.map(([text, href]) => el('a', { href, text, download: '' })));
}

// Asks again on every poll until the figures cover the clusters done (the server rebuilds them at most every few seconds).
async function showFigures(s) {
  const key = `${s.runs.done}:${s.state}`;
  if (key === figuresKey) return;
  const f = await getJson(`${api}/figures`);
  if (f.clustersDone === s.runs.done && (s.state !== 'running') === !f.partial) figuresKey = key;
  if (f.clustersDone === shownClusters && document.getElementById('figures').childElementCount === f.figures.length) return;
  shownClusters = f.clustersDone;
  const grid = document.getElementById('figures');
  grid.replaceChildren(...f.figures.map((x) => {
    const fig = el('figure', { 'data-name': x.name });
    fig.append(el('a', { href: x.svg, target: '_blank', title: 'open full size' }, el('img', { src: `${x.svg}?n=${f.clustersDone}`, alt: x.title })), el('figcaption', {}, richText(x.titleRuns)));
    return fig;
  }));
  document.getElementById('figures-count').textContent = f.partial ? `(partial: ${f.clustersDone} cluster(s) so far)` : `(${f.clustersDone} clusters)`;
  document.getElementById('figure-notes').textContent = f.notes.join('; ');
}

async function showPicture() {
  const box = document.getElementById('cluster');
  const r = await fetch(`${api}/cluster.png`);
  if (!r.ok) {
    const body = await r.json().catch(() => ({}));
    box.replaceChildren(el('p', { class: 'muted', text: body.error ?? `no picture (HTTP ${r.status})` }));
    pictureShown = r.status === 409; // 409: no picture for this ensemble (too large), do not ask again
    return;
  }
  const url = URL.createObjectURL(await r.blob());
  const check = r.headers.get('x-hash-check');
  box.replaceChildren(
    el('img', { src: url, alt: `run ${r.headers.get('x-run-index')}` }),
    el('p', { class: 'muted', text: `run ${r.headers.get('x-run-index')}, ${fmtInt(Number(r.headers.get('x-particles')))} particles, grown again from its task${check === 'matches' ? ': same state hash as the stored result' : ' (its result is not stored yet)'}` }),
  );
  pictureShown = check === 'matches';
}

async function poll() {
  if (polling) return;
  polling = true;
  try {
    const s = await getJson(api);
    document.title = `tendril: ${s.name || s.id}`;
    document.getElementById('title').textContent = s.name || s.id;
    document.getElementById('ensemble-id').textContent = s.id;
    document.getElementById('state').replaceChildren(stateBadge(s.state));
    document.getElementById('particles-bar').replaceChildren(bar(s.particles.done, s.particles.total, `${fmtInt(s.particles.done)} / ${fmtInt(s.particles.total)}`));
    document.getElementById('runs').textContent = `${s.runs.done} done, ${s.runs.running} running, ${s.runs.queued} queued, ${s.runs.failed} failed of ${s.runs.planned}`;
    const pr = s.probes;
    document.getElementById('probes').replaceChildren(pr ? bar(pr.done, pr.planned, `${pr.done} / ${pr.planned} probed${pr.failed ? `, ${pr.failed} failed` : ''}`) : document.createTextNode('no [probe] in the spec'));
    document.getElementById('throughput').textContent = s.state === 'running' ? fmtRate(s.throughput) : '–';
    document.getElementById('eta').textContent = s.state === 'running' ? fmtDuration(s.etaSeconds) : '–';
    document.getElementById('adaptive').textContent = s.adaptive ? `${s.adaptive.outcome}, ${s.adaptive.batches} batch(es), at most ${s.adaptive.maxClusters} clusters` : 'fixed count';
    const fails = [...s.failures.map((f) => `run ${f.runIndex}: ${f.reason}`), ...(pr?.failures ?? []).map((f) => `probe of run ${f.runIndex} at ${f.size}: ${f.reason}`)];
    const fd = document.getElementById('failures');
    fd.className = fails.length ? 'failures' : 'muted';
    fd.textContent = fails.length ? fails.join('; ') : 'none';
    const now = Date.now();
    points.push({ t: now, v: s.state === 'running' ? s.throughput : 0 });
    while (points.length > 400) points.shift();
    drawChart(document.getElementById('chart'), [{ label: s.name || s.id, points }], { now });
    document.getElementById('cancel-button').disabled = s.state !== 'running';
    showError(null);
    if (!pictureShown && !pictureBusy) {
      pictureBusy = true;
      showPicture().catch((e) => showError(`cluster picture: ${e.message}`)).finally(() => (pictureBusy = false));
    }
    await showFigures(s);
  } catch (e) {
    showError(e.message);
  } finally {
    polling = false;
  }
}

document.getElementById('cancel-form').addEventListener('submit', async (ev) => {
  ev.preventDefault();
  const msg = document.getElementById('message');
  const token = document.getElementById('cancel-token').value.trim();
  const r = await fetch(`${api}/cancel`, { method: 'POST', headers: token ? { authorization: `Bearer ${token}` } : {} });
  const body = await r.json().catch(() => ({}));
  msg.className = r.ok ? 'ok' : 'error';
  msg.textContent = r.ok ? 'cancelled: running runs stop within seconds' : body.error ?? `HTTP ${r.status}`;
  if (r.ok) poll();
});

downloads();
poll();
setInterval(poll, POLL_MS);
