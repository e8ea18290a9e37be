// The invitation journey in a real browser: an owner invites a new address, the mail lands in the local SMTP
// fake (read on the admin's mailbox page), the invitee follows the link, creates an account and arrives in the
// project as a viewer, where the owner-only controls are absent and the API refuses them anyway.
import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
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

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

async function signOut(page: Page) {
  await page.getByTestId("user-menu").click();
  await page.getByRole("menuitem", { name: "Sign out" }).click();
  // The plain sign-in page: whoever signs in next is not sent to the page the last person had open.
  await page.waitForURL(/\/sign-in$/);
}

describe("invitation by e-mail in headless Chromium", () => {
  it("takes an invitee from the mailed link to the project with the invited role, and no further", async () => {
    const { page } = browser;
    const errors: string[] = [];
    page.on("pageerror", (e) => errors.push(e.message));
    const suffix = randomUUID().slice(0, 6);
    const projectName = `Tidewater kelp study ${suffix}`;
    const invitee = `kai.invitee-${suffix}@fixture.emulant.test`;

    // A protected page sends a visitor to sign-in and back.
    await page.goto(server.baseUrl + "/projects");
    await page.waitForURL(/\/sign-in\?next=%2Fprojects/);
    await expect.poll(() => page.getByTestId("sign-in-link").isVisible()).toBe(true);
    await screenshot(page, "accounts-sign-in");

    await signIn(page, "owner@demo.emulant.test", "wrong-password");
    await expect.poll(() => page.getByRole("alert").textContent()).toContain("Wrong e-mail address or password");
    await signIn(page, "owner@demo.emulant.test", "demo-password");
    await page.waitForURL(/\/projects$/);
    await expect.poll(() => page.getByTestId("user-menu").textContent()).toContain("Oriel Fenwick");

    await page.getByLabel("New project name").fill(projectName);
    await page.getByRole("button", { name: "Create project" }).click();
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    const projectUrl = page.url();
    const projectId = projectUrl.split("/").pop()!;
    await expect.poll(() => page.getByTestId("project-role").textContent()).toBe("owner");
    await expect.poll(() => page.getByRole("button", { name: "Delete project…" }).isVisible()).toBe(true);

    await page.goto(server.baseUrl + "/projects");
    await page.getByTestId("project-search").fill(suffix);
    await expect.poll(() => page.getByTestId("projects-table").locator("tbody tr").count()).toBe(1);
    await screenshot(page, "accounts-project-list");

    await page.goto(`${projectUrl}/members`);
    await page.getByTestId("invite-panel").getByLabel("E-mail address").fill(invitee);
    await page.getByLabel("Role", { exact: true }).selectOption("viewer");
    await page.getByRole("button", { name: "Send invitation" }).click();
    await expect
      .poll(() => page.getByTestId("invite-panel").getByRole("status").textContent())
      .toContain(`Invitation sent to ${invitee} as viewer`);
    await expect.poll(() => page.getByTestId("pending-invitations").textContent()).toContain(invitee);
    await screenshot(page, "accounts-members-owner");
    await signOut(page);

    // The site admin reads the caught mail on the mailbox page.
    await signIn(page, "admin@demo.emulant.test", "demo-password");
    await page.waitForURL(/\/projects$/);
    await page.getByTestId("mailbox-link").click();
    await page.getByLabel("Recipient").fill(invitee);
    const link = page.getByTestId("mail-link").first();
    await expect.poll(() => link.isVisible(), { timeout: 15_000 }).toBe(true);
    await expect.poll(() => page.getByTestId("mailbox").textContent()).toContain(`invited you to "${projectName}"`);
    const href = (await link.getAttribute("href"))!;
    expect(href).toMatch(new RegExp(`^${server.baseUrl}/invitations/[A-Za-z0-9_-]{43}$`));
    await screenshot(page, "accounts-mailbox");
    await signOut(page);

    // The invitee follows the link, sets a name and password, and lands in the project as a viewer.
    await page.goto(href);
    await expect.poll(() => page.getByTestId("invited-role").textContent()).toBe("viewer");
    await page.getByLabel("Your name").fill("Kai Rendell");
    await page.getByLabel("Password").fill("short");
    await page.getByRole("button", { name: "Create account and join" }).click();
    await expect.poll(() => page.getByRole("alert").first().textContent()).toContain("at least 10 characters");
    await screenshot(page, "accounts-accept-invitation");
    await page.getByLabel("Password").fill("kai-password-2026");
    await page.getByRole("button", { name: "Create account and join" }).click();
    await page.waitForURL(projectUrl);
    await expect.poll(() => page.getByTestId("project-role").textContent()).toBe("viewer");
    await expect.poll(() => page.getByTestId("user-menu").textContent()).toContain("Kai Rendell");
    await screenshot(page, "accounts-project-viewer");

    // What a viewer may not do is not offered...
    expect(await page.getByTestId("project-settings").count()).toBe(0);
    expect(await page.getByRole("button", { name: /Delete project|Archive project|Rename/ }).count()).toBe(0);
    await page.getByRole("link", { name: "Members" }).click();
    await expect.poll(() => page.getByTestId("members-table").locator("tbody tr").count()).toBe(2);
    expect(await page.getByTestId("invite-panel").count()).toBe(0);
    expect(await page.getByRole("combobox").count()).toBe(0);
    expect(await page.getByRole("button", { name: /^Remove/ }).count()).toBe(0);
    await screenshot(page, "accounts-members-viewer");
    await page.getByRole("link", { name: "Audit log" }).click();
    await expect.poll(() => page.getByTestId("audit-log").textContent()).toContain("Kai Rendell joined as viewer");
    await screenshot(page, "accounts-audit");

    // ...and the API refuses it even when asked directly from the signed-in page.
    const refused = await page.evaluate(async (id) => {
      const rename = await fetch(`/api/projects/${id}`, {
        method: "PATCH",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ name: "Taken over" }),
      });
      const invite = await fetch(`/api/projects/${id}/invitations`, {
        method: "POST",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ email: "x@example.org", role: "owner" }),
      });
      return [rename.status, (await rename.json()).error.code, invite.status];
    }, projectId);
    expect(refused).toEqual([403, "FORBIDDEN", 403]);
    const row = await server
      .db("memberships as m")
      .join("users as u", "u.id", "m.user_id")
      .where({ "m.project_id": projectId, "u.email": invitee })
      .first();
    expect(row.role).toBe("viewer");
    expect(errors).toEqual([]);
  });
});
