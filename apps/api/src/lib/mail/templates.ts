export interface RenderedMail {
  template: string;
  subject: string;
  text: string;
  html: string;
}

export const escapeHtml = (s: string) =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

export function layout(title: string, paragraphs: string[], action?: { label: string; url: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join('');
  const button = action
    ? `<p style="margin:20px 0"><a href="${escapeHtml(action.url)}" style="background:#1f4e5f;color:#fff;padding:10px 16px;border-radius:8px;text-decoration:none">${escapeHtml(action.label)}</a></p>
       <p style="font-size:12px;color:#555">Or paste this address into your browser: ${escapeHtml(action.url)}</p>`
    : '';
  return `<!doctype html><html><body style="font-family:Manrope,Arial,sans-serif;color:#1b2330;max-width:560px;margin:auto;padding:24px">
<h1 style="font-size:18px">${escapeHtml(title)}</h1>${body}${button}
<p style="font-size:12px;color:#667">Femtoslot — beam time for the ultrafast laser facility.</p></body></html>`;
}

export function invitationMail(p: { name: string; inviterName: string; facility: string; role: string; url: string; hours: number }): RenderedMail {
  const lines = [
    `Hello ${p.name},`,
    `${p.inviterName} has invited you to Femtoslot at ${p.facility} as ${p.role}.`,
    `Choose a password to finish setting up your sign-in. The link works once and expires in ${p.hours} hours.`,
  ];
  return {
    template: 'invitation',
    subject: `You are invited to Femtoslot — ${p.facility}`,
    text: `${lines.join('\n\n')}\n\n${p.url}\n`,
    html: layout('Your invitation to Femtoslot', lines, { label: 'Set my password', url: p.url }),
  };
}

export function passwordResetMail(p: { name: string; url: string; minutes: number }): RenderedMail {
  const lines = [
    `Hello ${p.name},`,
    `Someone asked to reset the password of your Femtoslot sign-in. If it was you, choose a new one with the link below; it works once and expires in ${p.minutes} minutes.`,
    'If it was not you, ignore this message: your password stays as it is.',
  ];
  return {
    template: 'password_reset',
    subject: 'Reset your Femtoslot password',
    text: `${lines.join('\n\n')}\n\n${p.url}\n`,
    html: layout('Reset your password', lines, { label: 'Choose a new password', url: p.url }),
  };
}
