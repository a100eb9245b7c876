/**
 * A chart on screen → a file someone can paste into a review record: standalone SVG (styles inlined, the
 * app's fonts embedded, so it looks the same outside the app) and PNG (that SVG drawn on a canvas).
 *
 * The charts are styled by Tailwind classes and CSS variables that do not travel with an SVG file, so the
 * serialiser copies the computed value of each presentation property onto the clone as an attribute.
 */

const SVG_NS = 'http://www.w3.org/2000/svg';

/** Presentation properties that decide how a chart looks; copied from the live element's computed style. */
export const INLINED_PROPERTIES = [
  'fill',
  'fill-opacity',
  'stroke',
  'stroke-width',
  'stroke-dasharray',
  'stroke-linecap',
  'stroke-linejoin',
  'stroke-opacity',
  'opacity',
  'font-family',
  'font-size',
  'font-weight',
  'font-style',
  'font-variant-numeric',
  'text-anchor',
  'dominant-baseline',
  'letter-spacing',
  'visibility',
] as const;

export interface SerializeOptions {
  /** painted behind the chart (a PNG has no page under it); default the app's paper colour */
  background?: string;
  /** written as the SVG <title> (what the chart shows, for whoever opens the file) */
  title?: string;
  /** @font-face CSS to embed (see embeddedFontCss) */
  fontCss?: string;
}

function size(svg: SVGSVGElement): { width: number; height: number } {
  const box = svg.getBoundingClientRect();
  const attr = (name: string) => Number.parseFloat(svg.getAttribute(name) ?? '');
  const viewBox = svg.viewBox?.baseVal;
  const width = box.width || attr('width') || viewBox?.width || 600;
  const height = box.height || attr('height') || viewBox?.height || 300;
  return { width: Math.round(width), height: Math.round(height) };
}

/** Copy the computed presentation properties of `from` (live) onto `to` (clone), element by element. */
function inlineStyles(from: Element, to: Element): void {
  const computed = getComputedStyle(from);
  const declarations: string[] = [];
  for (const property of INLINED_PROPERTIES) {
    const value = computed.getPropertyValue(property);
    if (value) declarations.push(`${property}:${value}`);
  }
  // Keep whatever inline style the element had last, so explicit choices win over inherited ones.
  const own = to.getAttribute('style');
  to.setAttribute('style', declarations.join(';') + (own ? `;${own}` : ''));
  to.removeAttribute('class');
  const fromChildren = from.children;
  const toChildren = to.children;
  for (let i = 0; i < fromChildren.length; i++) inlineStyles(fromChildren[i], toChildren[i]);
}

/** A standalone SVG document of the chart as drawn now. */
export function serializeSvg(svg: SVGSVGElement, options: SerializeOptions = {}): string {
  const { width, height } = size(svg);
  const clone = svg.cloneNode(true) as SVGSVGElement;
  inlineStyles(svg, clone);
  // XMLSerializer writes the SVG namespace itself (the clone is an element in that namespace).
  clone.setAttribute('width', String(width));
  clone.setAttribute('height', String(height));
  if (!clone.getAttribute('viewBox')) clone.setAttribute('viewBox', `0 0 ${width} ${height}`);
  // Interactive-only parts (scrubber handles, focus rings) opt out with data-export="skip".
  clone.querySelectorAll('[data-export="skip"]').forEach((el) => el.remove());

  const doc = clone.ownerDocument;
  const background = doc.createElementNS(SVG_NS, 'rect');
  background.setAttribute('x', '0');
  background.setAttribute('y', '0');
  background.setAttribute('width', '100%');
  background.setAttribute('height', '100%');
  background.setAttribute('fill', options.background ?? '#fbfaf7');
  clone.insertBefore(background, clone.firstChild);

  if (options.fontCss) {
    const style = doc.createElementNS(SVG_NS, 'style');
    style.textContent = options.fontCss;
    clone.insertBefore(style, clone.firstChild);
  }
  if (options.title) {
    clone.querySelectorAll(':scope > title').forEach((el) => el.remove());
    const title = doc.createElementNS(SVG_NS, 'title');
    title.textContent = options.title;
    clone.insertBefore(title, clone.firstChild);
  }
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(clone)}`;
}

// --- fonts -------------------------------------------------------------------------------------------------

const fontCache = new Map<string, Promise<string>>();

function blobToDataUrl(blob: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result));
    reader.onerror = () => reject(reader.error);
    reader.readAsDataURL(blob);
  });
}

function fontDataUrl(url: string): Promise<string> {
  let pending = fontCache.get(url);
  if (!pending) {
    pending = fetch(url)
      .then((r) => (r.ok ? r.blob() : Promise.reject(new Error(`font ${url}: ${r.status}`))))
      .then(blobToDataUrl);
    fontCache.set(url, pending);
  }
  return pending;
}

/** The font families an SVG uses, from the computed styles of its text. */
function familiesIn(svg: SVGSVGElement): Set<string> {
  const out = new Set<string>();
  svg.querySelectorAll('text, tspan').forEach((el) => {
    const first = getComputedStyle(el).fontFamily.split(',')[0]?.trim().replace(/^["']|["']$/g, '');
    if (first) out.add(first.toLowerCase());
  });
  return out;
}

/**
 * @font-face rules for the families the chart uses, with the font files inlined as data: URLs, so the SVG
 * (and the canvas that rasterises it, which cannot fetch) draws in the app's own fonts. Only the Latin
 * subsets: chart labels are numbers, units and English words.
 */
export async function embeddedFontCss(svg: SVGSVGElement): Promise<string> {
  const families = familiesIn(svg);
  if (families.size === 0) return '';
  const rules: CSSFontFaceRule[] = [];
  for (const sheet of Array.from(document.styleSheets)) {
    let cssRules: CSSRuleList;
    try {
      cssRules = sheet.cssRules;
    } catch {
      continue; // a cross-origin sheet; the app ships none, but do not fail on one
    }
    for (const rule of Array.from(cssRules)) {
      if (!(rule instanceof CSSFontFaceRule)) continue;
      const family = rule.style.getPropertyValue('font-family').trim().replace(/^["']|["']$/g, '').toLowerCase();
      const range = rule.style.getPropertyValue('unicode-range');
      const latin = !range || /U\+0{1,4}-0{0,2}FF\b/i.test(range);
      if (families.has(family) && latin) rules.push(rule);
    }
  }
  const parts = await Promise.all(
    rules.map(async (rule) => {
      const src = rule.style.getPropertyValue('src');
      const match = /url\(["']?([^"')]+\.woff2?)["']?\)/.exec(src);
      if (!match) return '';
      const base = rule.parentStyleSheet?.href ?? document.baseURI;
      try {
        const data = await fontDataUrl(new URL(match[1], base).href);
        return `@font-face{font-family:${rule.style.getPropertyValue('font-family')};font-weight:${rule.style.getPropertyValue('font-weight') || 'normal'};font-style:${rule.style.getPropertyValue('font-style') || 'normal'};src:url(${data}) format("woff2");}`;
      } catch {
        return ''; // a missing font falls back to the system font; the chart itself still exports
      }
    }),
  );
  return parts.filter(Boolean).join('\n');
}

// --- raster and download -------------------------------------------------------------------------------------

/** Rasterise a standalone SVG at `scale` × its size (2 for a sharp image on a printed page). */
export async function svgToPngBlob(svgText: string, width: number, height: number, scale = 2): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml;charset=utf-8' }));
  try {
    const image = new Image();
    image.decoding = 'async';
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('the chart could not be drawn as an image'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const context = canvas.getContext('2d');
    if (!context) throw new Error('this browser gives no 2D canvas to draw the PNG on');
    context.scale(scale, scale);
    context.drawImage(image, 0, 0, width, height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error('the PNG could not be encoded'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Hand a blob to the browser as a download named `fileName`. */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.rel = 'noopener';
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Let the download start before the URL goes away.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function downloadText(text: string, fileName: string, type: string): void {
  // A BOM so spreadsheet programs read the CSV's °C and µ as UTF-8.
  const body = type.startsWith('text/csv') ? `\uFEFF${text}` : text;
  downloadBlob(new Blob([body], { type }), fileName);
}

/** Export the chart as a standalone SVG file. */
export async function exportChartSvg(svg: SVGSVGElement, fileBase: string, title?: string): Promise<void> {
  const text = serializeSvg(svg, { title, fontCss: await embeddedFontCss(svg) });
  downloadText(text, `${fileBase}.svg`, 'image/svg+xml');
}

/** Export the chart as a PNG at twice its on-screen size. */
export async function exportChartPng(svg: SVGSVGElement, fileBase: string, title?: string): Promise<void> {
  const text = serializeSvg(svg, { title, fontCss: await embeddedFontCss(svg) });
  const { width, height } = size(svg);
  downloadBlob(await svgToPngBlob(text, width, height), `${fileBase}.png`);
}

/** "Cure and temperatures — Two-dwell r3" → "cure-and-temperatures-two-dwell-r3" */
export function fileSlug(text: string): string {
  return (
    text
      .toLowerCase()
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 80) || 'chart'
  );
}
