"use client";

import { useState, type RefObject } from "react";

/** Saves a blob under a file name through a temporary link. */
function save(blob: Blob, name: string) {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/**
 * The chart's own svg inside a container: the largest drawn svg (legend swatches and the zero-size svg that holds the
 * shared DEP patterns come first in the page but are not the chart).
 */
function chartSvg(container: HTMLElement | null): SVGSVGElement | null {
  let best: SVGSVGElement | null = null;
  let bestArea = 0;
  for (const svg of Array.from(container?.querySelectorAll("svg") ?? [])) {
    if (svg.parentElement?.closest("svg")) continue;
    const box = svg.getBoundingClientRect();
    const area = box.width * box.height;
    if (area > bestArea) {
      best = svg;
      bestArea = area;
    }
  }
  return best;
}

/**
 * SVG text of the chart inside a container, standalone: white background, namespace, size, and copies of the patterns
 * and gradients it refers to by url(#id) but that live elsewhere on the page (the shared DEP hatching).
 */
function svgOf(container: HTMLElement | null): string | null {
  const svg = chartSvg(container);
  if (!svg) return null;
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  const box = svg.getBoundingClientRect();
  if (!copy.getAttribute("width")) copy.setAttribute("width", String(Math.round(box.width)));
  if (!copy.getAttribute("height")) copy.setAttribute("height", String(Math.round(box.height)));
  copy.setAttribute("style", `background:#ffffff;font-family:'DejaVu Sans',sans-serif`);
  // url(#id), url("#id") or url(&quot;#id&quot;) (a quoted reference inside a style attribute)
  const ids = new Set(Array.from(copy.outerHTML.matchAll(/url\(\s*(?:&quot;|["'])?#([^)"'&\s]+)/g), (m) => m[1]));
  const missing = Array.from(ids).filter((id) => !copy.querySelector(`[id="${CSS.escape(id)}"]`));
  if (missing.length > 0) {
    const defs = document.createElementNS("http://www.w3.org/2000/svg", "defs");
    for (const id of missing) {
      const found = document.getElementById(id);
      if (found) defs.appendChild(found.cloneNode(true));
    }
    copy.insertBefore(defs, copy.firstChild);
  }
  return new XMLSerializer().serializeToString(copy);
}

/** PNG of an SVG text, drawn at twice its size on a white background. */
async function pngOfSvg(svgText: string): Promise<Blob> {
  const img = new Image();
  const url = URL.createObjectURL(new Blob([svgText], { type: "image/svg+xml" }));
  await new Promise<void>((resolve, reject) => { img.onload = () => resolve(); img.onerror = () => reject(new Error("could not draw the chart")); img.src = url; });
  const canvas = document.createElement("canvas");
  canvas.width = Math.max(1, img.naturalWidth || img.width) * 2;
  canvas.height = Math.max(1, img.naturalHeight || img.height) * 2;
  const ctx = canvas.getContext("2d")!;
  ctx.fillStyle = "#ffffff";
  ctx.fillRect(0, 0, canvas.width, canvas.height);
  ctx.drawImage(img, 0, 0, canvas.width, canvas.height);
  URL.revokeObjectURL(url);
  return new Promise((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error("could not make the PNG"))), "image/png"));
}

/**
 * "SVG" and "PNG" buttons for a chart. Give either a container holding an svg chart, or `svg` (a function building the
 * SVG text, e.g. of a canvas chart) and optionally `canvas` (the drawn canvas, saved as PNG directly).
 */
export function ChartDownloads({ name, container, svg, canvas, label }: { name: string; label: string; container?: RefObject<HTMLElement | null>; svg?: () => string; canvas?: () => HTMLCanvasElement | null }) {
  const [problem, setProblem] = useState<string | null>(null);
  const svgText = () => (svg ? svg() : svgOf(container?.current ?? null));
  function onSvg() {
    const text = svgText();
    setProblem(text ? null : "The chart is not drawn yet; try again in a moment.");
    if (text) save(new Blob([text], { type: "image/svg+xml" }), `${name}.svg`);
  }
  async function onPng() {
    setProblem(null);
    try {
      const c = canvas?.();
      if (c) {
        save(await new Promise<Blob>((resolve, reject) => c.toBlob((b) => (b ? resolve(b) : reject(new Error("the canvas gave no image"))), "image/png")), `${name}.png`);
        return;
      }
      const text = svgText();
      if (!text) throw new Error("the chart is not drawn yet; try again in a moment");
      save(await pngOfSvg(text), `${name}.png`);
    } catch (e) {
      setProblem(`No PNG: ${(e as Error).message}.`);
    }
  }
  return (
    <span className="inline-flex items-center gap-2 text-xs" data-testid={`chart-downloads-${name}`}>
      <span className="text-ink-muted">{label}:</span>
      <button type="button" className="btn-quiet px-2 py-0.5 text-xs" onClick={onSvg}>SVG</button>
      <button type="button" className="btn-quiet px-2 py-0.5 text-xs" onClick={onPng}>PNG</button>
      {problem && <span className="text-danger" role="status">{problem}</span>}
    </span>
  );
}

/** A button that saves text built on demand as a file (CSV downloads of data already on the page). */
export function TextDownload({ name, build, children, type = "text/csv;charset=utf-8", testId }: { name: string; build: () => string; children: React.ReactNode; type?: string; testId?: string }) {
  return (
    <button type="button" className="btn-quiet px-2 py-1 text-xs" data-testid={testId} onClick={() => save(new Blob([build()], { type }), name)}>
      {children}
    </button>
  );
}
