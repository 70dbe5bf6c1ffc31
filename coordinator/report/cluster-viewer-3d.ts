/**
 * The 3D cluster in the HTML report: a static figure (the four depth-shaded
 * views of coordinator/render/spheres-picture.ts inside an SVG, so that it
 * has SVG and PNG copies like every figure) and an interactive view that can
 * be rotated by dragging and zoomed with the wheel.
 *
 * The interactive view is hand-drawn on a canvas, no library: every frame
 * the centres are rotated, sorted back to front and painted as shaded discs
 * (painter's algorithm) straight into an ImageData, coloured by arrival
 * order with the report's "ember" map and dimmed with depth. The centres are
 * embedded in the page as base64 Float32 triples (centred on the centroid)
 * with a 16-bit arrival fraction each. Clusters of more than VIEWER_MAX_BALLS
 * balls are drawn as an evenly spaced subsample in arrival order (every
 * k-th ball), and the page says so.
 */
import type { PointSet } from '../snapshot/cluster-snapshot.js';
import { buildPalette } from '../render/palette.js';
import { encodePng } from '../render/cluster-picture.js';
import { rasterizeSpheres } from '../render/spheres-picture.js';
import { escapeXml, FONT_FAMILY } from './svg-plot.js';
import type { Figure } from './plots.js';

/** At most this many balls are embedded in the interactive view. */
export const VIEWER_MAX_BALLS = 100_000;

export interface ClusterPicture3d {
  figure: Figure;
  /** The bare four-view raster (PNG). */
  png: Buffer;
  /** The interactive view: a self-contained HTML fragment (canvas and script). */
  viewerHtml: string;
  /** Balls drawn in the interactive view (all, or the subsample). */
  shown: number;
}

/** The static figure and the interactive view of one 3D cluster. */
export function clusterPicture3d(points: PointSet, runIndex: number | null, pixels = 900): ClusterPicture3d {
  if (points.dimension !== 3 || points.z === undefined) throw new RangeError('a 3D cluster picture needs a point set of dimension 3');
  const title = `Sample cluster${runIndex !== null ? ` (run ${runIndex})` : ''}: ${points.count} balls in 3D`;
  const png = encodePng(rasterizeSpheres(points, { size: pixels }));
  const W = 760, top = 34, img = 660, H = top + img + 40;
  const x0 = (W - img) / 2;
  const svg = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="${escapeXml(FONT_FAMILY)}">`,
    `<rect x="0" y="0" width="${W}" height="${H}" fill="#ffffff"/>`,
    `<text x="${x0}" y="24" font-size="17" font-weight="bold">${escapeXml(title)}</text>`,
    `<image x="${x0}" y="${top}" width="${img}" height="${img}" href="data:image/png;base64,${png.toString('base64')}"/>`,
    `<text x="${W / 2}" y="${top + img + 26}" font-size="13.5" text-anchor="middle" fill="#333">views along −z, +y, −x and from (1, 1, 1); colour: arrival order; nearer is brighter</text>`,
    '</svg>',
  ].join('\n');
  const caption =
    `One cluster of the ensemble${runIndex !== null ? ` (run index ${runIndex})` : ''}, ${points.count} balls of diameter ${points.diameter}, in four orthographic views on one scale: ` +
    'along −z (x right, y up), along +y (x right, z up), along −x (y right, z up) and from the direction (1, 1, 1) (z up); the axis key in each corner shows x red, y green, z blue. ' +
    'Colour: arrival order (first particle darkest); shading: light from the upper left, farther balls dimmer.';
  const viewer = viewerHtml(points);
  return { figure: { name: 'sample-cluster', title, caption, svg, note: null }, png, viewerHtml: viewer.html, shown: viewer.shown };
}

function viewerHtml(points: PointSet): { html: string; shown: number } {
  const n = points.count;
  const step = n > VIEWER_MAX_BALLS ? Math.ceil(n / VIEWER_MAX_BALLS) : 1;
  const shown = Math.ceil(n / step);
  const xyz = new Float32Array(3 * shown);
  const order = new Uint16Array(shown);
  let cx = 0, cy = 0, cz = 0;
  for (let i = 0; i < n; i++) {
    cx += points.x[i];
    cy += points.y[i];
    cz += points.z![i];
  }
  cx /= n;
  cy /= n;
  cz /= n;
  for (let j = 0, i = 0; i < n; i += step, j++) {
    xyz[3 * j] = points.x[i] - cx;
    xyz[3 * j + 1] = points.y[i] - cy;
    xyz[3 * j + 2] = points.z![i] - cz;
    order[j] = n > 1 ? Math.round((65535 * i) / (n - 1)) : 0;
  }
  const lut = buildPalette(256, 0, 1);
  const b64 = (a: ArrayBufferView): string => Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('base64');
  const note =
    step > 1
      ? `Showing one ball in every ${step}, in arrival order: ${shown} of ${n} (the view embeds at most ${VIEWER_MAX_BALLS}).`
      : `All ${n} balls.`;
  const html = [
    '<div class="viewer3d" id="viewer3d">',
    `<canvas id="viewer3d-canvas" width="720" height="720" style="background:#0e0e16;max-width:100%;cursor:grab;touch-action:none" data-balls="${shown}" data-total="${n}"></canvas>`,
    `<p id="viewer3d-note">Drag to rotate, wheel to zoom, double-click to reset. ${note} Colour: arrival order (first particle darkest); nearer balls are brighter.</p>`,
    `<script type="application/octet-stream" id="viewer3d-xyz">${b64(xyz)}</script>`,
    `<script type="application/octet-stream" id="viewer3d-order">${b64(order)}</script>`,
    `<script type="application/octet-stream" id="viewer3d-lut">${b64(lut)}</script>`,
    `<script>${VIEWER_SCRIPT.replace('__RADIUS__', String(0.5 * points.diameter))}</script>`,
    '</div>',
  ].join('\n');
  return { html, shown };
}

/** The viewer (plain browser JavaScript, no library). */
const VIEWER_SCRIPT = String.raw`(function () {
  'use strict';
  function bytes(id) {
    var s = atob(document.getElementById(id).textContent.trim());
    var b = new Uint8Array(s.length);
    for (var i = 0; i < s.length; i++) b[i] = s.charCodeAt(i);
    return b;
  }
  var xyz = new Float32Array(bytes('viewer3d-xyz').buffer);
  var order = new Uint16Array(bytes('viewer3d-order').buffer);
  var lut = bytes('viewer3d-lut');
  var radius = __RADIUS__;
  var n = order.length;
  var canvas = document.getElementById('viewer3d-canvas');
  var ctx = canvas.getContext('2d');
  var W = canvas.width, H = canvas.height;
  var image = ctx.createImageData(W, H);
  var px = image.data;
  var bound = radius;
  for (var i = 0; i < n; i++) {
    var d = Math.sqrt(xyz[3 * i] * xyz[3 * i] + xyz[3 * i + 1] * xyz[3 * i + 1] + xyz[3 * i + 2] * xyz[3 * i + 2]) + radius;
    if (d > bound) bound = d;
  }
  var sx = new Float32Array(n), sy = new Float32Array(n), depth = new Float32Array(n);
  var keys = new Float64Array(n);
  var yaw = 0.6, pitch = 0.35, zoom = 1;
  var pending = false;
  function draw() {
    pending = false;
    var cy = Math.cos(yaw), sy_ = Math.sin(yaw), cp = Math.cos(pitch), sp = Math.sin(pitch);
    var scale = zoom * 0.47 * Math.min(W, H) / bound;
    for (var i = 0; i < n; i++) {
      var x = xyz[3 * i], y = xyz[3 * i + 1], z = xyz[3 * i + 2];
      // yaw about the world z axis (up), then pitch about the screen x axis
      var x1 = cy * x - sy_ * y;
      var y1 = sy_ * x + cy * y;
      var up = cp * z - sp * y1;
      var toward = sp * z + cp * y1;
      sx[i] = W / 2 + scale * x1;
      sy[i] = H / 2 - scale * up;
      depth[i] = -toward;
      keys[i] = i;
    }
    var idx = Array.prototype.slice.call(keys);
    idx.sort(function (a, b) { return depth[b] - depth[a]; }); // far first
    for (var p = 0; p < px.length; p += 4) { px[p] = 14; px[p + 1] = 14; px[p + 2] = 22; px[p + 3] = 255; }
    var r = radius * scale;
    var r2 = r * r;
    for (var k = 0; k < n; k++) {
      var j = idx[k];
      var c = 3 * (order[j] >> 8);
      var near = 0.45 + 0.55 * Math.min(1, Math.max(0, (bound - depth[j]) / (2 * bound)));
      var fx = sx[j], fy = sy[j];
      if (r < 0.75) {
        var ix = fx | 0, iy = fy | 0;
        if (ix < 0 || iy < 0 || ix >= W || iy >= H) continue;
        var o = 4 * (iy * W + ix);
        px[o] = lut[c] * near; px[o + 1] = lut[c + 1] * near; px[o + 2] = lut[c + 2] * near;
        continue;
      }
      var x0 = Math.max(0, Math.floor(fx - r)), x1_ = Math.min(W - 1, Math.floor(fx + r));
      var y0 = Math.max(0, Math.floor(fy - r)), y1_ = Math.min(H - 1, Math.floor(fy + r));
      for (var yy = y0; yy <= y1_; yy++) {
        var dy = fy - (yy + 0.5);
        for (var xx = x0; xx <= x1_; xx++) {
          var dx = xx + 0.5 - fx;
          var h2 = r2 - dx * dx - dy * dy;
          if (h2 < 0) continue;
          var lam = (-0.45 * dx + 0.55 * dy + 0.7 * Math.sqrt(h2)) / (1.0173 * r);
          var f = near * (0.3 + 0.7 * (lam > 0 ? lam : 0));
          var q = 4 * (yy * W + xx);
          px[q] = lut[c] * f; px[q + 1] = lut[c + 1] * f; px[q + 2] = lut[c + 2] * f;
        }
      }
    }
    ctx.putImageData(image, 0, 0);
    canvas.setAttribute('data-frames', String(Number(canvas.getAttribute('data-frames') || '0') + 1));
  }
  function request() { if (!pending) { pending = true; requestAnimationFrame(draw); } }
  var dragging = false, lastX = 0, lastY = 0;
  canvas.addEventListener('pointerdown', function (e) { dragging = true; lastX = e.clientX; lastY = e.clientY; canvas.setPointerCapture(e.pointerId); canvas.style.cursor = 'grabbing'; });
  canvas.addEventListener('pointerup', function () { dragging = false; canvas.style.cursor = 'grab'; });
  canvas.addEventListener('pointermove', function (e) {
    if (!dragging) return;
    yaw += (e.clientX - lastX) * 0.01;
    pitch = Math.max(-1.55, Math.min(1.55, pitch + (e.clientY - lastY) * 0.01));
    lastX = e.clientX; lastY = e.clientY;
    request();
  });
  canvas.addEventListener('wheel', function (e) { e.preventDefault(); zoom = Math.max(0.2, Math.min(20, zoom * Math.exp(-e.deltaY * 0.001))); request(); }, { passive: false });
  canvas.addEventListener('dblclick', function () { yaw = 0.6; pitch = 0.35; zoom = 1; request(); });
  draw();
})();`;
