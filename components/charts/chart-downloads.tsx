"use client";

import type { RefObject } from "react";

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

/** SVG text of the first chart (svg element) inside a container, with white background and namespace. */
function svgOf(container: HTMLElement | null): string | null {
  const svg = container?.querySelector("svg[role='img'], svg.VictoryContainer, svg") as SVGSVGElement | null;
  if (!svg) return null;
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  const box = svg.getBoundingClientRect();
  if (!copy.getAttribute("width")) copy.setAttribute("width", String(Math.round(box.width)));
  if (!copy.getAttribute("height")) copy.setAttribute("height", String(Math.round(box.height)));
  copy.setAttribute("style", `background:#ffffff;font-family:'DejaVu Sans',sans-serif`);
  return new XMLSerializer().serializeToString(copy);
}

/** PNG of an SVG text, drawn at twice its size on a white background. */
async function pngOfSvg(svgText: string): Promise<Blob> {
  const img = new Image();
  const url = URL.createObjectURL(new Blob([svgText], { type: "image/svg+xml" }));
  await new Promise<void>((resolve, reject) => { img.onload = () => resolve(); img.onerror = () => reject(new Error("could not draw the chart")); img.src = url; });
  const canvas = document.createElement("canvas");
  canvas.width = img.width * 2;
  canvas.height = img.height * 2;
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
  const svgText = () => (svg ? svg() : svgOf(container?.current ?? null));
  async function onSvg() {
    const text = svgText();
    if (text) save(new Blob([text], { type: "image/svg+xml" }), `${name}.svg`);
  }
  async function onPng() {
    const c = canvas?.();
    if (c) return c.toBlob((b) => b && save(b, `${name}.png`), "image/png");
    const text = svgText();
    if (text) save(await pngOfSvg(text), `${name}.png`);
  }
  return (
    <span className="inline-flex items-center gap-2 text-xs" data-testid={`chart-downloads-${name}`}>
      <span className="text-ink-muted">{label}:</span>
      <button type="button" className="btn-quiet px-2 py-0.5 text-xs" onClick={onSvg}>SVG</button>
      <button type="button" className="btn-quiet px-2 py-0.5 text-xs" onClick={onPng}>PNG</button>
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
