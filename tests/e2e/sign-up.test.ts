import { describe, expect, it } from "vitest";
import { guardedContext } from "./support/browser";
import { DEMO_TEAM_NAME, demoEmail, signIn, unique } from "./support/demo";
import { linkFromOutbox, linkFromStoredMail } from "./support/outbox";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("sign-up and teams", () => {
  it("creates a team for a confirmed sign-up, whose owner can bring in an existing account", async () => {
    const founder = await guardedContext(e2e.browser, e2e.server.url);
    const email = `${unique("founder")}@signup.rillmark.test`;
    const teamName = unique("Silt Basin Engineers");
    await founder.page.goto("/sign-up");
    await founder.page.getByLabel("Work e-mail").fill(email);
    await founder.page.getByLabel("Your name").fill("Ada Mireles (test founder)");
    await founder.page.getByLabel("Password").fill("founder password 123");
    await founder.page.getByLabel("Team name").fill(teamName);
    await founder.page.getByRole("button", { name: "Send confirmation link" }).click();
    await founder.page.getByRole("heading", { name: "Check your e-mail" }).waitFor();
    await founder.page.getByText("npm run outbox").waitFor();

    // Nobody in the app may read mail to an address without an account: the machine's operator
    // takes the link from the local mail store.
    const confirmHref = await linkFromStoredMail(
      e2e.server.config.databaseUrl,
      e2e.server.config.publicBaseUrl,
      email,
      "/confirm-email",
    );

    await founder.page.goto(confirmHref);
    await founder.page.waitForURL(/\/teams\/[^/]+\/projects$/);
    await founder.page.getByRole("main").getByText(teamName, { exact: true }).waitFor();
    await founder.page.getByRole("form", { name: "New project" }).waitFor();

    // The founder invites the demo admin, who already has an account and is signed in.
    await founder.page
      .getByRole("navigation", { name: "Main" })
      .getByRole("link", { name: "Team" })
      .click();
    const invite = founder.page.getByRole("form", { name: "Invite someone" });
    await invite.getByLabel("E-mail address").fill(demoEmail("admin"));
    await invite.getByRole("radio", { name: /^Engineer/ }).check();
    await invite.getByRole("button", { name: "Send invitation" }).click();
    await founder.page.getByRole("status").filter({ hasText: "Invitation sent" }).waitFor();

    // The invited admin finds it in the Outbox as its recipient.
    const admin = await guardedContext(e2e.browser, e2e.server.url);
    await signIn(admin.page, demoEmail("admin"));

    const inviteHref = await linkFromOutbox(
      admin.page,
      [demoEmail("admin"), teamName],
      /\/invitations\//,
    );
    await admin.page.goto(inviteHref);
    await admin.page.getByRole("button", { name: `Join ${teamName}` }).click();
    await admin.page.waitForURL(/\/teams\/[^/]+\/projects$/);
    const newTeamUrl = admin.page.url();

    // With two teams the top bar offers a switch between them.
    const switcher = admin.page.getByRole("combobox", { name: "Team" });
    await switcher.waitFor();
    expect(await switcher.locator("option").allTextContents()).toEqual(
      expect.arrayContaining([teamName, DEMO_TEAM_NAME]),
    );
    await switcher.selectOption({ label: DEMO_TEAM_NAME });
    await admin.page.waitForURL(
      (url) => url.href !== newTeamUrl && url.pathname.endsWith("/projects"),
    );
    await admin.page.getByRole("main").getByText(DEMO_TEAM_NAME, { exact: true }).waitFor();

    expect(founder.offHostRequests).toEqual([]);
    expect(admin.offHostRequests).toEqual([]);
    await founder.close();
    await admin.close();
  });
});
