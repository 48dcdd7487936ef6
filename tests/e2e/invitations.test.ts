import { describe, expect, it } from "vitest";
import { guardedContext } from "./support/browser";
import { DEMO_TEAM_NAME, demoEmail, signIn, unique } from "./support/demo";
import { linkFromOutbox } from "./support/outbox";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("invitations", () => {
  it("lets an admin invite someone who opens the e-mailed link and joins the team", async () => {
    const admin = await guardedContext(e2e.browser, e2e.server.url);
    await signIn(admin.page, demoEmail("admin"));
    await admin.page
      .getByRole("navigation", { name: "Main" })
      .getByRole("link", { name: "Team" })
      .click();
    await admin.page.getByRole("heading", { level: 1, name: "Team" }).waitFor();

    const email = `${unique("newcomer")}@invited.rillmark.test`;
    const invite = admin.page.getByRole("form", { name: "Invite someone" });
    await invite.getByLabel("E-mail address").fill(email);
    await invite.getByRole("radio", { name: /^Reviewer/ }).check();
    await invite.getByRole("button", { name: "Send invitation" }).click();
    await admin.page
      .getByRole("status")
      .filter({ hasText: `Invitation sent to ${email}` })
      .waitFor();
    await admin.page
      .getByRole("region", { name: "Pending invitations" })
      .getByText(email)
      .waitFor();

    // The Outbox shows the mail the local mail server caught; its link is a real link.
    const href = await linkFromOutbox(admin.page, [email], /\/invitations\//);
    expect(href).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/invitations\/[A-Za-z0-9_-]+$/);

    // The invitee, in a browser of their own, follows the link and sets up the account.
    const invitee = await guardedContext(e2e.browser, e2e.server.url);
    await invitee.page.goto(href);
    await invitee.page
      .getByRole("heading", { name: `Join ${DEMO_TEAM_NAME} on Rillmark` })
      .waitFor();
    await invitee.page.getByText("Reviewer", { exact: true }).waitFor();
    await invitee.page.getByLabel("Your name").fill("Noor Haddad (test invitee)");
    await invitee.page.getByLabel("Choose a password").fill("a long invitee password");
    await invitee.page.getByLabel("Password, again").fill("a long invitee password");
    await invitee.page.getByRole("button", { name: /^Create account and join/ }).click();
    await invitee.page.waitForURL(/\/teams\/[^/]+\/projects$/);
    await invitee.page.getByRole("heading", { level: 1, name: "Projects" }).waitFor();
    await invitee.page.getByRole("main").getByText(DEMO_TEAM_NAME, { exact: true }).waitFor();

    // Back on the admin's Team page the newcomer is a member and no longer pending.
    await admin.page
      .getByRole("navigation", { name: "Main" })
      .getByRole("link", { name: "Team" })
      .click();
    const row = admin.page
      .getByRole("table", { name: /^Members of / })
      .getByRole("row")
      .filter({ hasText: email });
    await row.waitFor();
    expect(await row.getByLabel(/^Role of /).inputValue()).toBe("reviewer");
    await admin.page
      .getByRole("region", { name: "Pending invitations" })
      .getByText(email)
      .waitFor({ state: "detached" });

    expect(admin.offHostRequests).toEqual([]);
    expect(invitee.offHostRequests).toEqual([]);
    await invitee.close();
    await admin.close();
  });
});
