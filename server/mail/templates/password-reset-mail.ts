import { button, esc, htmlMail, paragraph, textMail, type MailBody, type Shop } from './layout';

export interface PasswordResetMailData {
  displayName: string;
  resetUrl: string;
  validForMinutes: number;
  shop: Shop;
}

/** The single-use link to choose a new password; says what to do when the request was not theirs. */
export function passwordResetMail(d: PasswordResetMailData): MailBody {
  const subject = 'Choose a new password for Loadline';
  const intro = `Hello ${d.displayName}, someone (we hope you) asked to choose a new password for your Loadline account.`;
  const validity = `The link works once, for ${d.validForMinutes} minutes.`;
  const notYou = 'If you did not ask for this, ignore this mail: your password stays as it is.';
  const html = htmlMail(
    d.shop,
    subject,
    [`<h1>${esc(subject)}</h1>`, paragraph(intro), button('Choose a new password', d.resetUrl), paragraph(validity), paragraph(notYou)].join('\n'),
  );
  const text = textMail(d.shop, [subject.toUpperCase(), intro, `Choose a new password: ${d.resetUrl}`, validity, notYou]);
  return { subject, text, html };
}
