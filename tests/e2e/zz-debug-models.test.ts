import { afterAll, beforeAll, it } from "vitest";
import { openBrowser } from "../support/browser";
import { startTestServer, type RunningServer } from "../support/test-app";
let server: RunningServer;
let browser: Awaited<ReturnType<typeof openBrowser>>;
beforeAll(async () => {
  server = await startTestServer();
  browser = await openBrowser();
  await browser.context.request.post(server.baseUrl + "/api/auth/sign-in", { data: { email: "modeler@demo.emulant.test", password: "demo-password" } });
});
afterAll(async () => { await browser?.close(); await server?.close(); });
it("debug", async () => {
  const { page } = browser;
  page.on("console", (m) => console.log("console", m.type(), m.text()));
  page.on("pageerror", (e) => console.log("pageerror", e.message));
  await page.goto(`${server.baseUrl}/projects/00000000-0000-4000-8000-000000000001/models/00000000-0000-4000-8000-000000000305`);
  await page.waitForTimeout(3000);
  await page.getByTestId("node-search").fill("Arr1");
  await page.waitForTimeout(1500);
});
