/** The e-mails Seamwright sends, as plain text with a simple HTML twin. */

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

function html(paragraphs: string[], link: string, linkText: string): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('');
  return `<!doctype html><html><body style="font-family:sans-serif">${body}<p><a href="${escapeHtml(link)}">${escapeHtml(linkText)}</a></p></body></html>`;
}

export function passwordResetMail(displayName: string, link: string) {
  const lines = [
    `Hello ${displayName},`,
    'Someone asked to reset the password of your Seamwright account. The link below works once, within one hour.',
    'If it was not you, ignore this e-mail: your password stays as it is.',
  ];
  return {
    subject: 'Reset your Seamwright password',
    text: `${lines.join('\n\n')}\n\n${link}\n`,
    html: html(lines, link, 'Choose a new password'),
  };
}

export function invitationMail(inviter: string, patternTitle: string, access: string, link: string, days: number) {
  const role = access === 'co-designer' ? 'a co-designer (you may edit it)' : 'a quilter (you may view, print and keep a sewing log)';
  const lines = [
    `${inviter} invites you to the pattern "${patternTitle}" on Seamwright as ${role}.`,
    `Open the link below to accept. It works for ${days} days.`,
  ];
  return {
    subject: `${inviter} shared "${patternTitle}" with you`,
    text: `${lines.join('\n\n')}\n\n${link}\n`,
    html: html(lines, link, 'Accept the invitation'),
  };
}
