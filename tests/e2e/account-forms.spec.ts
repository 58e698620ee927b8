import { expect, test } from "@playwright/test";

// The fake SMTP server's read-out, as the integration tests use it (scripts/fake-smtp.ts).
const mailboxUrl = `http://127.0.0.1:${process.env.BENCHFOLD_MAILBOX_PORT ?? 2581}`;

async function waitForMail(to: string, subject?: string): Promise<{ subject: string; text: string }> {
  const until = Date.now() + 15_000;
  while (Date.now() < until) {
    const { messages } = (await (await fetch(`${mailboxUrl}/messages`)).json()) as { messages: { to: string; subject: string; text: string }[] };
    const found = messages.find((m) => m.to.split(", ").includes(to) && (subject === undefined || m.subject === subject));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${to}`);
}

test("a visitor signs up as a customer through the form, forgets the password and sets a new one from the mailed link", async ({ page }) => {
  // Eight pages and two mails in one flow: 30 s is too little for the first pages of a run on a loaded machine.
  test.setTimeout(120_000);
  const email = `buyer-${Date.now()}-${Math.random().toString(36).slice(2, 8)}@benchfold-tests.example`;
  await page.goto("/sign-up");
  const form = page.getByTestId("sign-up-form");
  await form.getByLabel("Your name").fill("Iris Halloran");
  await form.getByLabel("Work e-mail address").fill(email);
  await form.getByLabel("Company or institution").fill("Corvane Test Systems");
  await form.getByLabel("New password").fill("a long sentence for a password");
  await form.getByLabel("Repeat the password").fill("a different sentence entirely");
  await form.getByRole("button", { name: "Create customer account" }).click();
  // Checked in the browser, before anything is sent: the field says what is wrong.
  await expect(form.getByLabel("Repeat the password")).toHaveAttribute("aria-invalid", "true");
  await expect(form).toContainText("The two passwords differ.");
  await expect(page).toHaveURL(/\/sign-up$/);

  // A common password is refused by the shared strength check before anything is sent.
  await form.getByLabel("New password").fill("password123");
  await form.getByLabel("Repeat the password").fill("password123");
  await form.getByRole("button", { name: "Create customer account" }).click();
  await expect(form.getByLabel("New password")).toHaveAttribute("aria-invalid", "true");
  await expect(form).toContainText("commonly used password");

  await form.getByLabel("New password").fill("a long sentence for a password");
  // The estimator's verdict shows while typing; the server applies the same schema.
  await expect(form).toContainText("Strong enough (estimated strength 4 of 4).");
  await form.getByLabel("Repeat the password").fill("a long sentence for a password");
  await form.getByRole("button", { name: "Create customer account" }).click();
  // The answer is the same for any address; the mailed link creates the account.
  await expect(page.getByText(`A message is on its way to ${email}`)).toBeVisible();
  const confirmation = await waitForMail(email);
  await page.goto(new URL(/https?:\/\/\S+/.exec(confirmation.text)![0]).pathname);
  await page.getByRole("button", { name: "Create my account" }).click();
  await expect(page.getByText("Your customer account for")).toBeVisible();
  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill("a long sentence for a password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("session-name")).toHaveText("Iris Halloran", { timeout: 15_000 });

  // Signed out, the customer asks for a reset link and sets a new password with it.
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("banner").getByRole("link", { name: "Sign in" })).toBeVisible();
  await page.goto("/password-reset");
  await page.getByTestId("request-reset-form").getByLabel("E-mail address").fill(email);
  await page.getByRole("button", { name: "Send the link" }).click();
  await expect(page.getByText("a link to choose a new password is on its way")).toBeVisible();
  const mail = await waitForMail(email, "Reset your Benchfold password");
  const link = new URL(/https?:\/\/\S+/.exec(mail.text)![0]);

  await page.goto(link.pathname);
  const reset = page.getByTestId("complete-reset-form");
  await reset.getByLabel("New password").fill("short");
  await reset.getByLabel("Repeat the password").fill("short");
  await reset.getByRole("button", { name: "Set the new password" }).click();
  await expect(reset.getByLabel("New password")).toHaveAttribute("aria-invalid", "true");

  await reset.getByLabel("New password").fill("another long sentence, new");
  await reset.getByLabel("Repeat the password").fill("another long sentence, new");
  await reset.getByRole("button", { name: "Set the new password" }).click();
  await expect(page.getByText("Your password is changed")).toBeVisible();

  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").fill(email);
  await page.getByLabel("Password").fill("another long sentence, new");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByTestId("session-name")).toHaveText("Iris Halloran", { timeout: 15_000 });
});
