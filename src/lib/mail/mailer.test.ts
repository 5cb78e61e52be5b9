import { describe, expect, it } from "vitest";
import { requireEnv, waitForMail } from "@/test/services";
import { createMailer } from "./mailer";

describe("mail (nodemailer against the local fake)", () => {
  const mailer = createMailer({
    host: requireEnv("SMTP_HOST"),
    port: Number(requireEnv("SMTP_PORT")),
    secure: false,
    from: "Pulsefence <no-reply@pulsefence.invalid>",
  });

  it("sends an e-mail that the fake's API gives back", async () => {
    const to = `bench-${crypto.randomUUID()}@example.test`;
    await mailer.send({ to, subject: "Measured pulse failed", text: "Pulse P-7 fails on candidate A." });
    const mail = await waitForMail(to);
    expect(mail.subject).toBe("Measured pulse failed");
    expect(mail.text.trim()).toBe("Pulse P-7 fails on candidate A.");
  });

  it("verifies the connection", async () => {
    await expect(mailer.ping()).resolves.toBeUndefined();
  });
});
