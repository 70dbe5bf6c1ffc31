/**
 * PNG renderings of the report's SVG figures, rasterised by resvg
 * (@resvg/resvg-js: a Rust SVG renderer whose prebuilt binary ships inside
 * npm packages, so nothing is downloaded outside npm). Text is set in Roboto
 * from @expo-google-fonts/roboto (TTF files inside that npm package); system
 * fonts are not loaded, so a PNG looks the same on every machine, and the
 * same font is embedded in the HTML page so the inline SVGs look the same.
 *
 * If the native renderer cannot be loaded on a platform, `pngRenderer()`
 * returns null with the reason, and the report carries SVGs only.
 */
import { createRequire } from 'node:module';
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { messageOf } from '../../proto/errors.js';

const require = createRequire(import.meta.url);

/** Font files (regular, italic, bold) of Roboto inside the npm package, or [] if it is missing. */
export function fontFiles(): string[] {
  try {
    const root = dirname(require.resolve('@expo-google-fonts/roboto/package.json'));
    return ['400Regular/Roboto_400Regular.ttf', '400Regular_Italic/Roboto_400Regular_Italic.ttf', '700Bold/Roboto_700Bold.ttf']
      .map((f) => join(root, f)).filter((f) => existsSync(f));
  } catch {
    return [];
  }
}

/** The regular and italic Roboto faces as base64, for @font-face in the HTML page. */
export function embeddableFonts(): { style: 'normal' | 'italic'; weight: 'normal' | 'bold'; base64: string }[] {
  const files = fontFiles();
  const out: { style: 'normal' | 'italic'; weight: 'normal' | 'bold'; base64: string }[] = [];
  for (const f of files) {
    out.push({ style: /Italic/.test(f) ? 'italic' : 'normal', weight: /Bold/.test(f) ? 'bold' : 'normal', base64: readFileSync(f).toString('base64') });
  }
  return out;
}

interface ResvgModule {
  Resvg: new (svg: string, options?: Record<string, unknown>) => { render(): { asPng(): Buffer; width: number; height: number } };
}

export interface PngRenderer {
  /** Rasterise an SVG at `scale` times its own size (default 2: crisp on screens and in print). */
  render(svg: string, scale?: number): Buffer;
  fonts: string[];
}

let cached: { renderer: PngRenderer | null; reason: string | null } | undefined;

/** The resvg-based renderer, or null (with the reason) when it cannot be loaded. */
export function pngRenderer(): { renderer: PngRenderer | null; reason: string | null } {
  if (cached) return cached;
  let mod: ResvgModule;
  try {
    mod = require('@resvg/resvg-js') as ResvgModule;
  } catch (e) {
    cached = { renderer: null, reason: `PNG renderer @resvg/resvg-js could not be loaded: ${messageOf(e)}` };
    return cached;
  }
  const fonts = fontFiles();
  const renderer: PngRenderer = {
    fonts,
    render(svg: string, scale = 2): Buffer {
      if (!(scale > 0 && scale <= 8)) throw new RangeError(`PNG scale must be in (0, 8], got ${scale}`);
      const r = new mod.Resvg(svg, {
        fitTo: { mode: 'zoom', value: scale },
        background: '#ffffff',
        font: { fontFiles: fonts, loadSystemFonts: fonts.length === 0, defaultFontFamily: 'Roboto', sansSerifFamily: 'Roboto' },
        shapeRendering: 2,
        textRendering: 1,
      });
      return r.render().asPng();
    },
  };
  cached = { renderer, reason: fonts.length ? null : 'Roboto font files not found: PNG text uses system fonts' };
  return cached;
}
