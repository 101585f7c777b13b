// Plain-text first: these must read well in any mail client, including the Outbox.
export function invitationMail(args: { companyName: string; inviterName: string; roleLabel: string; link: string }) {
  return {
    subject: `You are invited to ${args.companyName} on Plumeline`,
    text: [
      `${args.inviterName} invited you to join ${args.companyName} on Plumeline as ${args.roleLabel}.`,
      "",
      `Accept the invitation: ${args.link}`,
      "",
      "The link works for 7 days. If you were not expecting this, you can ignore this message.",
    ].join("\n"),
  };
}

export function passwordResetMail(args: { name: string; link: string }) {
  return {
    subject: "Reset your Plumeline password",
    text: [
      `Hello ${args.name},`,
      "",
      `Someone asked to reset the password of your Plumeline account. Choose a new one here: ${args.link}`,
      "",
      "The link works for one hour and only once. If it was not you, ignore this message: your password stays as it is.",
    ].join("\n"),
  };
}

export function signUpConfirmMail(args: { name: string; companyName: string; link: string }) {
  return {
    subject: `Confirm your e-mail to open ${args.companyName} on Plumeline`,
    text: [
      `Hello ${args.name},`,
      "",
      `To open ${args.companyName} on Plumeline with this address as its owner, confirm here: ${args.link}`,
      "",
      "The link works for 24 hours and only once. If it was not you, ignore this message: nothing is created.",
    ].join("\n"),
  };
}

export function signUpExistingAccountMail(args: { name: string; signInLink: string }) {
  return {
    subject: "You already have a Plumeline account",
    text: [
      `Hello ${args.name},`,
      "",
      `Someone asked to open a new company on Plumeline with this address, which already has an account. Sign in here: ${args.signInLink}`,
      "",
      "If it was not you, ignore this message: nothing was changed.",
    ].join("\n"),
  };
}
