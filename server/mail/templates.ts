/**
 * The e-mails Carbwright sends, each in plain text and simple HTML, in one voice: say who did what, what the link
 * does, how long it works, and what to do if it was not expected.
 */
export type ProfileRoleName = 'owner' | 'carer' | 'clinician';

/** What each kind of message needs; `link` values are absolute URLs built with `mailLink`. */
export type MailData = {
  /** Someone invites a person to a profile (carer, clinician, or as its owner when a managed profile is handed over). */
  invitation: { inviterName: string; profileName: string; role: ProfileRoleName; link: string; expiresAt: Date };
  /** Someone offers a recipe; `hasAccount` false means the link asks them to join first. */
  share_offer: { senderName: string; recipeName: string; link: string; hasAccount: boolean };
  /** A link to choose a new password. */
  password_reset: { link: string; expiresInMinutes: number };
  /** Someone's access to a profile was taken away. */
  access_revoked: { profileName: string; revokedByName: string; role: ProfileRoleName };
  /** Sent to the old address once the change is done. */
  email_changed: { oldEmail: string; newEmail: string };
  /** Sent to the new address: confirm it before it replaces the old one. */
  email_change_confirm: { newEmail: string; link: string; expiresInMinutes: number };
  /** Sent to the new address instead of a link when an account already uses it (the requester is told nothing). */
  email_change_taken: { newEmail: string };
};

export type MailKind = keyof MailData;
export const MAIL_KINDS = ['invitation', 'share_offer', 'password_reset', 'access_revoked', 'email_changed', 'email_change_confirm', 'email_change_taken'] as const satisfies readonly MailKind[];

export type RenderedMail = { subject: string; text: string; html: string };

const ROLE_WORDS: Record<ProfileRoleName, string> = {
  owner: 'as its owner: the profile becomes yours',
  carer: 'as a carer: you can plan, cook, log meals and check doses for them',
  clinician: 'as a clinician: you can read their logbook, settings and reviews',
};

const SIGN_OFF = 'Carbwright\nCarbwright does arithmetic with the settings a person enters; ratios and doses come from their diabetes team.';
const NOT_YOU = 'If you did not expect this, you can ignore this message; nothing changes until the link is used.';

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function when(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/** A message from paragraphs; a paragraph `{ link, label }` becomes a button in HTML and a bare URL in text. */
type Part = string | { link: string; label: string };

function compose(subject: string, parts: Part[]): RenderedMail {
  const text = [...parts.map((p) => (typeof p === 'string' ? p : `${p.label}:\n${p.link}`)), SIGN_OFF].join('\n\n');
  const body = parts
    .map((p) =>
      typeof p === 'string'
        ? `<p>${escapeHtml(p)}</p>`
        : `<p><a href="${escapeHtml(p.link)}" style="display:inline-block;padding:10px 16px;background:#7B2148;color:#FFF8F1;border-radius:8px;text-decoration:none">${escapeHtml(p.label)}</a></p>\n<p style="font-size:13px;color:#62564C">Or paste this address into your browser: ${escapeHtml(p.link)}</p>`,
    )
    .join('\n');
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>
<body style="font-family:Georgia,serif;color:#2B231F;background:#F6F0E4;padding:16px;line-height:1.5;max-width:560px">
${body}
<p style="font-size:13px;color:#62564C">${SIGN_OFF.split('\n').map(escapeHtml).join('<br>')}</p>
</body></html>`;
  return { subject, text, html };
}

const RENDER: { [K in MailKind]: (data: MailData[K]) => RenderedMail } = {
  invitation: (d) =>
    compose(`${d.inviterName} invites you to ${d.profileName}'s kitchen on Carbwright`, [
      `${d.inviterName} has invited you to ${d.profileName}'s profile on Carbwright, ${ROLE_WORDS[d.role]}.`,
      { link: d.link, label: 'Accept the invitation' },
      `Sign in or create an account with this e-mail address to accept. The link works once, until ${when(d.expiresAt)}.`,
      NOT_YOU,
    ]),
  share_offer: (d) =>
    compose(`${d.senderName} offers you a recipe: ${d.recipeName}`, [
      `${d.senderName} would like to share the recipe "${d.recipeName}" with you on Carbwright.`,
      d.hasAccount
        ? 'Open it to see the ingredients and weights, then keep a copy on your shelf or decline it.'
        : 'You do not have a Carbwright account with this address yet. Create one to see the recipe, then keep a copy or decline it.',
      { link: d.link, label: d.hasAccount ? 'See the recipe' : 'Join and see the recipe' },
      'Nothing is added to your recipes unless you accept it.',
    ]),
  password_reset: (d) =>
    compose('Choose a new Carbwright password', [
      'Someone asked to reset the password of the Carbwright account with this e-mail address.',
      { link: d.link, label: 'Choose a new password' },
      `The link works once, for ${d.expiresInMinutes} minutes. Using it signs out every other device.`,
      'If you did not ask for this, ignore this message: your password stays as it is.',
    ]),
  access_revoked: (d) =>
    compose(`Your access to ${d.profileName}'s profile has ended`, [
      `${d.revokedByName} has ended your access to ${d.profileName}'s profile on Carbwright (you were a ${d.role}).`,
      'You can no longer open their recipes, logbook or settings. Anything you saved on your own profile stays yours.',
      'If you think this is a mistake, talk to them directly.',
    ]),
  email_changed: (d) =>
    compose('Your Carbwright e-mail address has changed', [
      `The e-mail address of your Carbwright account has changed from ${d.oldEmail} to ${d.newEmail}. From now on, sign in with the new address.`,
      // A reset would now go to the new address, so it cannot help someone whose address was taken over.
      'If you did not make this change, ask the person who runs your Carbwright to lock the account straight away: a password reset now goes to the new address.',
    ]),
  email_change_confirm: (d) =>
    compose('Confirm your new Carbwright e-mail address', [
      `Someone asked to use ${d.newEmail} as the e-mail address of a Carbwright account.`,
      { link: d.link, label: 'Confirm this address' },
      `The old address keeps working until you confirm. The link works once, for ${d.expiresInMinutes} minutes.`,
      NOT_YOU,
    ]),
  email_change_taken: (d) =>
    compose('Someone asked to use this address on Carbwright', [
      `Someone signed in to a Carbwright account asked to use ${d.newEmail} as its e-mail address. An account already uses this address, so nothing has changed.`,
      'If it was you, you already have an account here: sign in with this address, or choose another address for the other account.',
      'If you did not expect this, you can ignore this message.',
    ]),
};

/** Renders one message (subject, plain text, simple HTML) from its kind and data. */
export function renderMail<K extends MailKind>(kind: K, data: MailData[K]): RenderedMail {
  return (RENDER[kind] as (d: MailData[K]) => RenderedMail)(data);
}
