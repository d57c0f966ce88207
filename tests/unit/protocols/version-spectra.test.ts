import { describe, expect, it } from "vitest";
import { evaluateSpectra, waterPermittivity } from "@/lib/dielectric";
import { spectraBody, toSeries } from "@/lib/wizard/spectra-request";
import { versionSpectra } from "@/lib/protocols/version-spectra";
import { yeastProtocolContent } from "@/tests/support/protocol-content";

describe("versionSpectra", () => {
  const content = yeastProtocolContent();
  const s = content.selection;
  const full = toSeries(evaluateSpectra(spectraBody(content.populations.target.spec, "target", 0, { conductivity: s.conductivity, permittivity: waterPermittivity(s.temperatureC) })));

  it("gives both populations' curves, Re[K] rounded to 4 significant digits (within 5e-4 relative of the engine), crossovers unrounded", () => {
    const got = versionSpectra(content, "");
    if (!got.ok) throw new Error(got.message);
    expect(got.lines.map((l) => l.key)).toEqual(["target", "other"]);
    const target = got.lines[0].series;
    expect(target.mean).toHaveLength(full.mean.length);
    target.mean.forEach((v, j) => expect(Math.abs(v - full.mean[j])).toBeLessThanOrEqual(Math.abs(full.mean[j]) * 5e-4));
    expect(target.mean.filter((v) => Number(v.toPrecision(4)) !== v)).toEqual([]);
    expect(full.mean.filter((v) => Number(v.toPrecision(4)) !== v).length).toBeGreaterThan(0);
    expect(target.crossovers).toEqual(full.crossovers);
  });

  it("keeps the result per content hash: the same hash returns the same object, an empty hash recomputes", () => {
    const a = versionSpectra(content, "hash-a");
    expect(versionSpectra(content, "hash-a")).toBe(a);
    expect(versionSpectra(content, "")).not.toBe(versionSpectra(content, ""));
  });

  it("says why in words when the content cannot be evaluated", () => {
    const broken = yeastProtocolContent();
    broken.populations.target.spec = { ...broken.populations.target.spec, model: { kind: "nonsense" } } as never;
    const got = versionSpectra(broken, "");
    expect(got.ok).toBe(false);
    if (!got.ok) expect(got.message.length).toBeGreaterThan(0);
  });
});
