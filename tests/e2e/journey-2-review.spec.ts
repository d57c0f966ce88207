import { expect, test, type Browser, type Page } from "./support/test";
import { subjectOf } from "@/lib/format/mime";
import { readCapturedMail } from "@/lib/mail/sink";
import { approvedProtocolWithDraft, closeJourneyDb } from "@/tests/support/protocol-journey";
import { DEMO, DEMO_PASSWORD, signIn, snap } from "./support/auth";

/** Journey 2 (DESIGN.md): review, return, revise, sign-off with password re-entry, supervisor mail, superseded. */

let data: { protocolId: number; code: string };
const title = `Journey two yeast viability ${Date.now()}`;

test.beforeAll(async () => {
  data = await approvedProtocolWithDraft({ title, author: DEMO.developer, signer: "rhea.qa@example.test", password: DEMO_PASSWORD });
});
test.afterAll(closeJourneyDb);

async function as(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, email);
  return page;
}

const versionUrl = (n: number) => `/protocols/${data.protocolId}/versions/${n}`;

test("developer submits, reviewer returns, developer revises, reviewer signs off; supervisor is e-mailed; v1 is superseded", async ({ browser }) => {
  test.setTimeout(120_000);
  const dana = await as(browser, DEMO.developer);
  const quinn = await as(browser, DEMO.reviewer);

  await dana.goto(versionUrl(2));
  await expect(dana.getByTestId("version-state")).toHaveText("Draft");
  await snap(dana, "journey2-01-draft");
  await dana.getByRole("button", { name: "Submit for review" }).click();
  await expect(dana.getByTestId("version-state")).toHaveText("In review");

  await quinn.goto("/review");
  const row = quinn.getByTestId(`queue-${data.code}-v2`);
  await expect(row).toBeVisible();
  await expect(row.getByTestId("own-work")).toHaveCount(0);
  await snap(quinn, "journey2-02-review-queue");
  await row.getByRole("link", { name: "Compare" }).click();
  await expect(quinn.getByRole("heading", { name: `${data.code}: version 2 against version 1` })).toBeVisible();
  await expect(quinn.getByTestId("diff-row").filter({ hasText: "frequency" })).toContainText("5 MHz");
  await expect(quinn.getByTestId("window-changed")).toHaveCount(1);
  await snap(quinn, "journey2-03-diff");

  await quinn.goto(versionUrl(2));
  await expect(quinn.getByTestId("integrity-ok")).toBeVisible();
  await expect(quinn.getByTestId("version-spectra")).toBeVisible();
  await snap(quinn, "journey2-04-version-in-review");
  await quinn.getByLabel("Comment to the author").fill("Give the wash centrifugation time and speed in the preparation notes.");
  await quinn.getByRole("button", { name: "Return to author" }).click();
  await expect(quinn.getByTestId("version-state")).toHaveText("Returned");

  await dana.reload();
  await expect(dana.getByTestId("version-state")).toHaveText("Returned");
  await expect(dana.getByTestId("comment")).toContainText("wash centrifugation time and speed");
  await expect(dana.getByRole("button", { name: "Save draft" })).toBeEnabled();
  await dana.getByLabel("Washes").fill("3");
  await dana.getByLabel("Preparation notes").fill("Wash three times in buffer, 2 min at 1000 g each.");
  await snap(dana, "journey2-05-returned-editing");
  await dana.getByRole("button", { name: "Save draft" }).click();
  await expect(dana.getByTestId("version-state")).toHaveText("Draft");
  await dana.getByRole("button", { name: "Submit for review" }).click();
  await expect(dana.getByTestId("version-state")).toHaveText("In review");

  await quinn.goto(versionUrl(2));
  await expect(quinn.getByText("Wash three times in buffer")).toBeVisible();
  await quinn.getByLabel("Meaning of your signature").selectOption("Approved for bench use");
  await quinn.getByLabel("Your password").fill("not-my-password");
  await quinn.getByRole("button", { name: "Sign off version 2" }).click();
  await expect(quinn.getByTestId("approve-status")).toContainText("not your current password");
  await expect(quinn.getByTestId("version-state")).toHaveText("In review");
  await quinn.getByLabel("Your password").fill(DEMO_PASSWORD);
  await quinn.getByRole("button", { name: "Sign off version 2" }).click();
  await expect(quinn.getByTestId("version-state")).toHaveText("Approved");
  const signature = quinn.getByTestId("signature");
  await expect(signature).toContainText("Approved for bench use");
  await expect(signature).toContainText("Quinn Abara · QA reviewer");
  await expect(signature).toContainText(/SHA-256 [0-9a-f]{64}/);
  await snap(quinn, "journey2-06-signed-off");

  const subject = `Signed off: ${data.code} version 2`;
  await expect
    .poll(
      () =>
        readCapturedMail(process.env.MAIL_SINK_DIR ?? "")
          .filter((m) => m.to.includes(DEMO.supervisor) && subjectOf(m.raw) === `${subject} — ${title}`).length,
      { timeout: 30_000, message: `the supervisor's sign-off message for ${data.code} v2 reaches the SMTP sink` },
    )
    .toBe(1);

  await quinn.goto(versionUrl(1));
  await expect(quinn.getByTestId("version-state")).toHaveText("Superseded");
  await expect(quinn.getByTestId("superseded-notice")).toBeVisible();
  await snap(quinn, "journey2-07-v1-superseded");
  await quinn.goto(`/protocols/${data.protocolId}`);
  await expect(quinn.getByTestId("version-row-1")).toContainText("Superseded");
  await expect(quinn.getByTestId("version-row-2")).toContainText("Approved");
  await snap(quinn, "journey2-08-history");

  const sam = await as(browser, DEMO.supervisor);
  await sam.goto("/mail");
  await expect(sam.getByTestId("outbox")).toContainText(subject);
  await snap(sam, "journey2-09-mail");
  await sam.goto(`/audit?entity=protocol_version`);
  await expect(sam.getByTestId("audit-table")).toContainText(`${data.code} v2: signed off by Quinn Abara`);
  await expect(sam.getByTestId("audit-chain")).toHaveAttribute("data-state", "intact"); // hash chain recomputed, no break
  await expect(sam.getByTestId("audit-chain")).toContainText(/Hash chain intact: [\d\u2009]+ events checked/);
  await snap(sam, "journey2-10-audit");
  const csv = await sam.request.get(`/api/v1/audit.csv?entity=protocol_version&action=protocol_version.approve`);
  expect(csv.status()).toBe(200);
  expect(await csv.text()).toContain(`${data.code} v2: signed off by Quinn Abara`);

  await sam.goto("/protocols");
  await snap(sam, "journey2-11-protocol-list");
});

test("technicians are refused the protocol list (they use the bench list)", async ({ page }) => {
  await signIn(page, DEMO.technician);
  const response = await page.goto("/protocols");
  expect(response?.status()).toBe(403);
  await expect(page.getByTestId("forbidden")).toBeVisible();
});
