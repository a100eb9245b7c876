// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { fileSlug, serializeSvg } from './chart-export';

// jsdom computes styles from <style> rules, which is what the serialiser has to carry into the file.

function mount(markup: string, css = ''): SVGSVGElement {
  document.head.innerHTML = `<style>${css}</style>`;
  document.body.innerHTML = markup;
  return document.querySelector('svg')!;
}

function parse(text: string): Document {
  const doc = new DOMParser().parseFromString(text.replace(/^<\?xml[^>]*>\s*/, ''), 'image/svg+xml');
  expect(doc.querySelector('parsererror')).toBeNull();
  return doc;
}

describe('serializeSvg', () => {
  it('writes a standalone SVG document with namespace, size, background and title', () => {
    const svg = mount('<svg width="320" height="180"><path d="M0 0L10 10" /></svg>');
    const text = serializeSvg(svg, { title: 'Cure, run A and run B', background: '#ffffff' });
    expect(text.startsWith('<?xml version="1.0" encoding="UTF-8"?>')).toBe(true);
    const root = parse(text).documentElement;
    expect(root.namespaceURI).toBe('http://www.w3.org/2000/svg');
    expect(root.getAttribute('width')).toBe('320');
    expect(root.getAttribute('height')).toBe('180');
    expect(root.getAttribute('viewBox')).toBe('0 0 320 180');
    expect(root.querySelector('title')?.textContent).toBe('Cure, run A and run B');
    expect(root.querySelector('rect')?.getAttribute('fill')).toBe('#ffffff');
    expect(root.querySelector('path')?.getAttribute('d')).toBe('M0 0L10 10');
  });

  it('inlines the styles a class gave each element, and drops the class', () => {
    const svg = mount(
      '<svg width="100" height="50"><g class="series-b"><path class="line" d="M0 0L5 5" /></g><text class="label">°C</text></svg>',
      '.series-b .line { stroke: rgb(62, 92, 134); stroke-dasharray: 6 3; stroke-width: 1.5px; fill: none } .label { font-family: "JetBrains Mono", monospace; font-size: 10px }',
    );
    const doc = parse(serializeSvg(svg));
    const path = doc.querySelector('path')!;
    const style = path.getAttribute('style') ?? '';
    expect(style).toMatch(/stroke:\s*rgb\(62, 92, 134\)/);
    expect(style).toMatch(/stroke-dasharray:\s*6 3/);
    expect(style).toMatch(/fill:\s*none/);
    expect(path.hasAttribute('class')).toBe(false);
    const text = doc.querySelector('text')!;
    expect(text.getAttribute('style')).toMatch(/font-family:\s*"?JetBrains Mono"?/);
    expect(text.textContent).toBe('°C');
  });

  it('leaves out parts marked as screen-only', () => {
    const svg = mount('<svg width="10" height="10"><line data-export="skip" x1="0" x2="1" /><circle r="2" /></svg>');
    const doc = parse(serializeSvg(svg));
    expect(doc.querySelector('line')).toBeNull();
    expect(doc.querySelector('circle')).not.toBeNull();
  });

  it('leaves the chart on screen untouched', () => {
    const svg = mount('<svg width="10" height="10" class="chart"><circle class="dot" r="2" /></svg>', '.dot { fill: red }');
    serializeSvg(svg);
    expect(svg.getAttribute('class')).toBe('chart');
    expect(svg.querySelector('circle')!.getAttribute('class')).toBe('dot');
    expect(svg.querySelector('rect')).toBeNull();
  });
});

describe('fileSlug', () => {
  it('makes a file-name-safe lower-case slug', () => {
    expect(fileSlug('Cure & temperatures — Two-dwell r3')).toBe('cure-temperatures-two-dwell-r3');
    expect(fileSlug('***')).toBe('chart');
  });
});
