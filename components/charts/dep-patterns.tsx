/**
 * SVG patterns shared by every chart: positive DEP = ember with diagonal hatching, negative DEP = tide with dots, so the
 * two regions differ by pattern as well as colour (readable in greyscale and with colour-vision deficiency).
 */
export function DepPatterns() {
  return (
    <svg width="0" height="0" aria-hidden="true" focusable="false" style={{ position: "absolute" }}>
      <defs>
        <pattern id="sw-pdep" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="8" height="8" fill="#f5e1d6" />
          <line x1="0" y1="0" x2="0" y2="8" stroke="#a4471c" strokeWidth="1.2" strokeOpacity="0.45" />
        </pattern>
        <pattern id="sw-ndep" width="8" height="8" patternUnits="userSpaceOnUse">
          <rect width="8" height="8" fill="#dfe6f4" />
          <circle cx="4" cy="4" r="1.1" fill="#2f4f8f" fillOpacity="0.5" />
        </pattern>
      </defs>
    </svg>
  );
}

/** A small legend swatch of a DEP region pattern. */
export function DepSwatch({ kind }: { kind: "pdep" | "ndep" }) {
  return (
    <svg width="22" height="14" aria-hidden="true" className="inline-block align-middle">
      <rect width="22" height="14" fill={`url(#sw-${kind})`} stroke={kind === "pdep" ? "#a4471c" : "#2f4f8f"} strokeWidth="1" />
    </svg>
  );
}
