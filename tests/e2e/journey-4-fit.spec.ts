import { expect, test } from "./support/test";
import { exampleCrossoverCsv } from "@/lib/fitting";
import { DEMO, signIn, snap } from "./support/auth";

// Crossovers generated in the test from known, invented parameters with the fitting library's generator:
// C = 0.0105 F/m² (1.05 µF/cm²), G = 180 S/m², r = 3.6 µm; one bad row (a non-numeric crossover) is inserted as row 4.
const KNOWN_C_UF_CM2 = 1.05;
function crossoverCsv(): string {
  const lines = exampleCrossoverCsv({ capacitance: 0.0105, conductance: 180, radius: 3.6e-6 }).trimEnd().split("\n");
  return [...lines.slice(0, 3), "30,abc,22", ...lines.slice(3)].join("\n") + "\n";
}

const numbers = (s: string) => [...s.matchAll(/-?\d+(?:\.\d+)?(?:e[+-]?\d+)?/gi)].map((m) => Number(m[0]));

test("journey 4: a developer fits membrane parameters from crossovers and saves them to a population", async ({ page }) => {
  await signIn(page, DEMO.developer);
  await page.goto("/library/populations");
  await expect(page.getByRole("heading", { name: "Populations" })).toBeVisible();
  await snap(page, "journey4-01-populations");
  await page.getByRole("link", { name: "Quarry Hill live lymphocytes" }).click();
  await expect(page.getByTestId("item-name")).toHaveText("Quarry Hill live lymphocytes");
  const before = Number((await page.getByText(/· version \d+/).first().textContent())!.match(/version (\d+)/)![1]);
  await snap(page, "journey4-02-population-detail");

  await page.getByRole("link", { name: "Fit from crossovers" }).click();
  await expect(page.getByRole("heading", { name: /Fit membrane parameters/ })).toBeVisible();
  await page.getByTestId("csv-input").setInputFiles({ name: "quarry-hill-crossovers.csv", mimeType: "text/csv", buffer: Buffer.from(crossoverCsv(), "utf8") });
  const errors = page.getByTestId("csv-errors");
  await expect(errors).toContainText("row 4");
  await expect(errors).toContainText("abc");
  await expect(page.getByRole("button", { name: "Run the fit" })).toBeDisabled();
  await snap(page, "journey4-03-row-error");

  await page.getByTestId("drop-bad-rows").check();
  await page.getByRole("button", { name: "Run the fit" }).click();
  const c = page.getByTestId("estimate-c");
  const g = page.getByTestId("estimate-g");
  await expect(c).toContainText("µF/cm²");
  await expect(c).toContainText("95 % CI");
  await expect(g).toContainText("S/m²");
  await expect(g).toContainText("95 % CI");
  const [estimate] = numbers((await page.getByTestId("estimate-c-value").textContent())!);
  const [lower, upper] = numbers((await page.getByTestId("estimate-c-ci").textContent())!.replace("95 % CI", ""));
  expect(lower).toBeLessThan(KNOWN_C_UF_CM2); // the known C lies inside the 95 % interval
  expect(upper).toBeGreaterThan(KNOWN_C_UF_CM2);
  expect(Math.abs(estimate - KNOWN_C_UF_CM2) / KNOWN_C_UF_CM2).toBeLessThan(0.05);
  await expect(page.getByTestId("residuals-chart")).toBeVisible();
  await expect(page.getByTestId("fit-curve-chart")).toBeVisible();
  await snap(page, "journey4-04-fit-result");

  await page.getByRole("button", { name: `Save as version ${before + 1}` }).click();
  await expect(page).toHaveURL(/\/library\/populations\/\d+$/);
  await expect(page.getByTestId("current-provenance")).toHaveText("Fitted from data");
  await expect(page.getByTestId(`version-${before + 1}`)).toContainText("Fitted from data");
  await expect(page.getByTestId("provenance-source")).toContainText("quarry-hill-crossovers.csv");
  await expect(page.getByTestId("fit-summary")).toContainText("rows left out for errors: 4");
  await expect(page.getByTestId("version-diff")).toContainText("Membrane capacitance");
  await snap(page, "journey4-05-saved-version");
});

test("libraries: buffers and devices read in lab units, and a bad value is refused next to its field", async ({ page }) => {
  await signIn(page, DEMO.developer);
  await page.goto("/library/buffers");
  await expect(page.getByTestId("library-list")).toContainText("Isotonic sucrose–glucose, 10 mS/m");
  await snap(page, "library-buffers");
  await page.getByRole("link", { name: "Isotonic sucrose–glucose, 10 mS/m" }).click();
  await expect(page.getByTestId("current-content")).toContainText("10 mS/m (100 µS/cm)");
  await snap(page, "library-buffer-detail");

  await page.goto("/library/buffers/new");
  await page.getByLabel("Name").fill("Too salty test buffer");
  await page.getByLabel("Target conductivity at 25 °C").fill("5000");
  await page.getByLabel("Change note").fill("test entry");
  await page.getByRole("button", { name: "Create buffer" }).click();
  await expect(page.getByText("Target conductivity at 25 °C (mS/m): enter a number between 0.01 and 2000 mS/m.")).toBeVisible();
  await expect(page.getByTestId("recipe-prediction")).toContainText("mOsm/kg");
  await snap(page, "library-buffer-new-error");

  await page.goto("/library/devices");
  await page.getByRole("link", { name: "Interdigitated chip, 40 µm electrodes" }).click();
  await expect(page.getByTestId("current-content")).toContainText("40 µm");
  await expect(page.getByTestId("current-content")).toContainText("m⁻³");
  await snap(page, "library-device-detail");
  await page.getByRole("link", { name: "Edit" }).click();
  await expect(page.getByLabel("Electrode gap")).toHaveValue("40");
  await snap(page, "library-device-edit");

  await page.goto("/library/populations?q=Larkspur&sort=name");
  await expect(page.getByTestId("library-list").getByRole("link")).toHaveText(["Larkspur heat-killed brewing yeast", "Larkspur viable brewing yeast"]);
  await page.getByRole("link", { name: "Larkspur viable brewing yeast" }).click();
  await page.getByRole("link", { name: "Edit" }).click();
  await expect(page.getByLabel("Wall thickness (nm)")).toHaveValue("240");
  await snap(page, "library-population-edit");
});
