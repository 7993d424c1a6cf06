// Plain transactional e-mails: a text part and a simple, inline-styled HTML part.
const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

function layout(title: string, paragraphs: string[], action: { label: string; url: string }) {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escape(p)}</p>`).join("");
  return `<!doctype html><html><body style="margin:0;background:#f4f6f8;font-family:system-ui,sans-serif;color:#161d27">
<div style="max-width:560px;margin:24px auto;background:#fff;border:1px solid #cdd5de;border-radius:12px;padding:24px">
<p style="margin:0 0 16px;font-weight:700;color:#155d54">Placewright</p>
<h1 style="font-size:20px;margin:0 0 16px">${escape(title)}</h1>${body}
<p style="margin:20px 0"><a href="${escape(action.url)}" style="display:inline-block;background:#155d54;color:#fff;text-decoration:none;padding:12px 20px;border-radius:8px;font-weight:600">${escape(action.label)}</a></p>
<p style="font-size:13px;color:#445466;margin:0">Or paste this address into your browser: ${escape(action.url)}</p>
</div></body></html>`;
}

export function signInLinkMail(name: string, url: string, minutes: number) {
  const lines = [`Hello ${name},`, `Use this link to sign in to Placewright. It works once and expires in ${minutes} minutes.`, "If you did not ask for it, ignore this e-mail."];
  return {
    subject: "Your Placewright sign-in link",
    text: `${lines.join("\n\n")}\n\n${url}\n`,
    html: layout("Sign in to Placewright", lines, { label: "Sign in", url }),
  };
}

export function invitationMail(name: string, inviter: string, projectName: string | null, url: string, days: number) {
  const lines = [
    `Hello ${name},`,
    projectName
      ? `${inviter} invited you to the project ${projectName} on Placewright.`
      : `${inviter} invited you to Placewright.`,
    `Open the link to choose your password. It expires in ${days} days.`,
  ];
  return {
    subject: "You are invited to Placewright",
    text: `${lines.join("\n\n")}\n\n${url}\n`,
    html: layout("Join Placewright", lines, { label: "Choose a password", url }),
  };
}
