import { renderMail, type RenderedMail } from "../layout";

/** The e-mails that let a person in: an invitation and a password reset. Pure: every fact is passed in. */

const footer = (shopName: string) => `Sent by Cotter for ${shopName}. If you did not expect this, you can ignore it: nothing happens until the link is used.`;

export function invitationMail(p: {
  shopName: string;
  name: string;
  invitedBy: string;
  roleLabel: string;
  accountName: string | null;
  expiresOn: string;
  url: string;
}): RenderedMail {
  const where = p.accountName ? `${p.accountName}'s ${p.roleLabel.toLowerCase()}` : `${p.roleLabel.toLowerCase()} at ${p.shopName}`;
  return renderMail({
    subject: `${p.invitedBy} invited you to Cotter (${p.shopName})`,
    heading: `Welcome to Cotter, ${p.name}`,
    paragraphs: [
      `${p.invitedBy} has added you as ${where}. Cotter is where ${p.shopName} and the fleets it serves follow each unit's visit, the work found, and the estimate.`,
      "Open the link to choose your own password. Nobody else knows it, and the link works once.",
    ],
    facts: [["Link good until", p.expiresOn]],
    action: { label: "Choose your password", url: p.url },
    footer: footer(p.shopName),
  });
}

export function passwordResetMail(p: { shopName: string; name: string; minutes: number; url: string }): RenderedMail {
  return renderMail({
    subject: "Your Cotter password reset link",
    heading: "Choose a new password",
    paragraphs: [
      `${p.name}, someone (we hope you) asked to reset your Cotter password.`,
      `The link works once, for ${p.minutes} minutes. Choosing a new password signs you out everywhere else.`,
    ],
    action: { label: "Choose a new password", url: p.url },
    footer: footer(p.shopName),
  });
}
