// Accounts and the project list in a real browser: sign-up with its checks and its mailed link, the profile page, the project table's
// search, sort and paging, and deleting a project only after typing its name.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { screenshot } from "../support/browser";
import { openBrowserSession, type BrowserSession } from "../support/browser-session";

let browser: BrowserSession;
let server: BrowserSession["server"];

beforeAll(async () => {
  browser = await openBrowserSession();
  server = browser.server;
});
afterAll(() => browser?.close());

describe("accounts and projects in headless Chromium", () => {
  it("signs up with checked input, renames on the profile page, and pages, sorts, searches and deletes projects", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    const email = `lena-${randomUUID().slice(0, 8)}@fixture.emulant.test`;

    await page.goto(server.baseUrl + "/sign-up");
    await page.getByLabel("Your name").fill("x".repeat(121));
    await page.getByLabel("E-mail address").fill("not-an-address");
    await page.getByLabel("Password").fill("short");
    await page.getByRole("button", { name: "Create account" }).click();
    // The field itself stops at the 120-character limit the server enforces.
    expect((await page.getByLabel("Your name").inputValue()).length).toBe(120);
    await expect
      .poll(() => page.getByRole("alert").allTextContents())
      .toEqual(["Enter a valid e-mail address, like name@example.org", "A password needs at least 10 characters"]);
    await screenshot(page, "accounts-sign-up-errors");
    await page.getByLabel("Your name").fill("Lena Brightwater");
    await page.getByLabel("E-mail address").fill(email);
    await page.getByLabel("Password").fill("lena-password-1");
    await page.getByRole("button", { name: "Create account" }).click();
    await expect.poll(() => page.getByRole("status").textContent()).toContain(`We sent a message to ${email}`);
    await screenshot(page, "accounts-sign-up-sent");
    const mail = await server.db("mail_messages").whereRaw("? = any(mail_to)", [email]).first();
    const link = /http\S+\/sign-up\/finish#[A-Za-z0-9_-]+/.exec(mail.text_body)![0];
    await page.goto(server.baseUrl + new URL(link).pathname + new URL(link).hash);
    await page.waitForURL(/\/projects$/);
    await expect.poll(() => page.getByTestId("user-menu").textContent()).toContain("Lena Brightwater");

    await page.getByTestId("user-menu").click();
    await page.getByRole("menuitem", { name: "Profile" }).click();
    await page.getByLabel("Display name").fill("Lena B. Brightwater");
    await page.getByRole("button", { name: "Save name" }).click();
    await expect.poll(() => page.getByTestId("user-menu").textContent()).toContain("Lena B. Brightwater");
    await page.getByLabel("Current password").fill("not-my-password");
    await page.getByLabel("New password").fill("lena-password-2");
    await page.getByRole("button", { name: "Change password" }).click();
    await expect.poll(() => page.getByRole("alert").textContent()).toBe("The current password is not right");
    await screenshot(page, "accounts-profile");

    // Twelve projects through the API with the browser's own session, so the table has two pages.
    const created = await page.evaluate(async () => {
      const names = Array.from({ length: 12 }, (_, i) => `Algae set ${String(i + 1).padStart(2, "0")}`);
      for (const name of names)
        await fetch("/api/projects", {
          method: "POST",
          headers: { "Content-Type": "application/json" },
          body: JSON.stringify({ name }),
        });
      return names.length;
    });
    expect(created).toBe(12);
    await page.goto(server.baseUrl + "/projects");
    const table = page.getByTestId("projects-table");
    const firstCell = () => table.locator("tbody tr").first().locator("td").first().textContent();
    await expect.poll(() => table.locator("tbody tr").count()).toBe(10);
    await expect.poll(() => page.getByText("Page 1 of 2").isVisible()).toBe(true);
    expect(await firstCell()).toBe("Algae set 01");
    await table.getByRole("button", { name: /Name/ }).click();
    await expect.poll(firstCell).toBe("Algae set 12");
    await page.getByRole("button", { name: "Next" }).click();
    await expect.poll(() => table.locator("tbody tr").count()).toBe(2);
    await page.getByTestId("project-search").fill("set 07");
    await expect.poll(() => table.locator("tbody tr").count()).toBe(1);
    await screenshot(page, "accounts-project-search");

    await table.getByRole("link", { name: "Algae set 07" }).click();
    await page.getByRole("button", { name: "Delete project…" }).click();
    const dialog = page.getByRole("dialog");
    const confirm = dialog.getByRole("button", { name: "Delete for good" });
    expect(await confirm.isDisabled()).toBe(true);
    await dialog.getByLabel("Type the project's name to confirm").fill("algae set 07");
    expect(await confirm.isDisabled()).toBe(true);
    await screenshot(page, "accounts-delete-dialog");
    await dialog.getByLabel("Type the project's name to confirm").fill("Algae set 07");
    await confirm.click();
    await page.waitForURL(/\/projects$/);
    await expect.poll(() => page.getByText("11 of 11 projects").isVisible()).toBe(true);
    expect(errors).toEqual([]);
  });
});
