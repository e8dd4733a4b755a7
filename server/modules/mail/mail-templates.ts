/**
 * Tidefield's e-mails. Each has a plain-text and an HTML part written from the same pieces;
 * the HTML uses inline styles and the reader's own fonts, with no images, web fonts or other
 * external resources, so it looks the same offline and in clients that block remote content.
 */
import { ROLE_LABELS, type Role } from '../../../shared/contracts/roles.ts';
import type { MailMessage } from './mailer.ts';

type Content = Omit<MailMessage, 'to' | 'departmentId' | 'kind'>;

interface Layout {
  heading: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  details?: [string, string][];
  /** Why the reader got this, and how to stop it where that applies. */
  footer: string;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

const utc = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' });
export const formatUtc = (date: Date) => `${utc.format(date)} UTC`;
export const formatMoney = (minor: number, currency: string) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
const count = (n: number) => n.toLocaleString('en-GB');

function render(layout: Layout): Pick<Content, 'text' | 'html'> {
  const text = [
    layout.heading,
    '',
    ...layout.paragraphs.flatMap((p) => [p, '']),
    ...(layout.details?.length ? [...layout.details.map(([k, v]) => `${k}: ${v}`), ''] : []),
    ...(layout.action ? [`${layout.action.label}:`, layout.action.url, ''] : []),
    '--',
    layout.footer,
  ].join('\n');

  const cell = 'padding:4px 12px 4px 0;vertical-align:top';
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(layout.heading)}</title></head>
<body style="margin:0;padding:24px;background:#eef1f4;color:#14212b;font-family:-apple-system,'Segoe UI',Helvetica,Arial,sans-serif;font-size:16px;line-height:1.5">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #c9d2da;border-radius:8px;padding:28px">
<p style="margin:0 0 16px;font-weight:700;letter-spacing:.04em;color:#8a5a00">TIDEFIELD</p>
<h1 style="margin:0 0 16px;font-size:22px;line-height:1.3">${escapeHtml(layout.heading)}</h1>
${layout.paragraphs.map((p) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join('\n')}
${
  layout.details?.length
    ? `<table role="presentation" style="border-collapse:collapse;margin:0 0 16px">${layout.details
        .map(([k, v]) => `<tr><td style="${cell};color:#4d5d6b">${escapeHtml(k)}</td><td style="${cell};font-weight:700">${escapeHtml(v)}</td></tr>`)
        .join('')}</table>`
    : ''
}
${
  layout.action
    ? `<p style="margin:20px 0"><a href="${escapeHtml(layout.action.url)}" style="display:inline-block;background:#f2b705;color:#14212b;font-weight:700;text-decoration:none;padding:12px 18px;border-radius:6px">${escapeHtml(layout.action.label)}</a></p>
<p style="margin:0 0 16px;font-size:14px;color:#4d5d6b">If the button does not work, open this address: <span style="word-break:break-all">${escapeHtml(layout.action.url)}</span></p>`
    : ''
}
<p style="margin:24px 0 0;padding-top:16px;border-top:1px solid #dde3e8;font-size:14px;color:#4d5d6b">${escapeHtml(layout.footer)}</p>
</div></body></html>`;
  return { text, html };
}

export function invitationEmail(input: { departmentName: string; inviterName: string; role: Role; link: string; expiresAt: Date }): Content {
  const role = ROLE_LABELS[input.role].toLowerCase();
  return {
    subject: `Join ${input.departmentName} on Tidefield`,
    ...render({
      heading: `${input.inviterName} invited you to ${input.departmentName}`,
      paragraphs: [
        `You are invited to join ${input.departmentName} on Tidefield as ${role === 'admin' || role === 'observer' ? 'an' : 'a'} ${role}. Tidefield runs Monte Carlo population synthesis of magnetic white dwarfs.`,
        `The link works once and until ${formatUtc(input.expiresAt)}. If you have no account yet you choose a name and a password; if you have one, you sign in.`,
      ],
      action: { label: 'Accept the invitation', url: input.link },
      footer: 'You got this because an admin of that department entered your address. If you did not expect it, ignore it: nothing happens unless the link is used.',
    }),
  };
}

export function passwordResetEmail(input: { name: string; link: string; expiresAt: Date }): Content {
  return {
    subject: 'Reset your Tidefield password',
    ...render({
      heading: 'Choose a new password',
      paragraphs: [
        `Hello ${input.name}, someone (we hope you) asked to reset the password of your Tidefield account.`,
        `The link works once and until ${formatUtc(input.expiresAt)}. Choosing a new password signs you out everywhere else and revokes your API tokens.`,
      ],
      action: { label: 'Choose a new password', url: input.link },
      footer: 'If you did not ask for this, ignore this e-mail: your password stays as it is.',
    }),
  };
}

export function runFinishedEmail(input: {
  name: string;
  scenarioName: string;
  systems: number;
  /** The predicted fraction as text (fractionOrLimitText): value ± Monte Carlo error, or the 95% upper limit when none was drawn; null without white dwarfs. */
  fraction: string | null;
  link: string;
  settingsLink: string;
}): Content {
  const fraction = input.fraction === null ? 'no white dwarfs formed' : input.fraction.includes('upper limit') ? input.fraction : `${input.fraction} (Monte Carlo standard error)`;
  return {
    subject: `Run finished: ${input.scenarioName}`,
    ...render({
      heading: `Your run of ${input.scenarioName} has finished`,
      paragraphs: [`Hello ${input.name}, the run is done and its result is stored.`],
      details: [
        ['Systems', count(input.systems)],
        ['Predicted magnetic fraction', fraction],
      ],
      action: { label: 'Open the run', url: input.link },
      footer: `You get this because run notices are on for your account. Switch them off at ${input.settingsLink}`,
    }),
  };
}

export function runFailedEmail(input: { name: string; scenarioName: string; error: string; refundedCredits: number; link: string; settingsLink: string }): Content {
  return {
    subject: `Run failed: ${input.scenarioName}`,
    ...render({
      heading: `Your run of ${input.scenarioName} failed`,
      paragraphs: [
        `Hello ${input.name}, the run stopped with this error: ${input.error}`,
        input.refundedCredits > 0
          ? `Its ${count(input.refundedCredits)} credit${input.refundedCredits === 1 ? ' was' : 's were'} given back to the department, with any free systems of this month it used.`
          : 'Any free systems of this month it used were given back to the department.',
      ],
      action: { label: 'Open the run', url: input.link },
      footer: `You get this because failure notices are on for your account. Switch them off at ${input.settingsLink}`,
    }),
  };
}

export function receiptEmail(input: {
  departmentName: string;
  receiptNumber: string;
  packName: string;
  credits: number;
  unitAmount: number;
  currency: string;
  paidAt: Date;
  balance: number;
  link: string;
}): Content {
  return {
    subject: `Receipt ${input.receiptNumber}: ${count(input.credits)} Tidefield credits`,
    ...render({
      heading: `Receipt ${input.receiptNumber}`,
      paragraphs: [`Thank you. ${count(input.credits)} credits were added to ${input.departmentName}.`],
      details: [
        ['Receipt', input.receiptNumber],
        ['Paid', formatUtc(input.paidAt)],
        ['Item', input.packName],
        ['Credits', count(input.credits)],
        ['Amount', formatMoney(input.unitAmount, input.currency)],
        ['Balance now', `${count(input.balance)} credits`],
      ],
      action: { label: 'See credits and receipts', url: input.link },
      footer: 'You get this because you bought credit for your department on Tidefield. Keep it for your records.',
    }),
  };
}

export function sweepFinishedEmail(input: {
  name: string;
  sweepName: string;
  points: number;
  succeeded: number;
  failed: number;
  cancelled: number;
  systems: number;
  /** The smallest and largest predicted fraction over the succeeded points, as text ("< 0.0012% (95% upper limit, …)" for none drawn). */
  lowest: string | null;
  highest: string | null;
  link: string;
  settingsLink: string;
}): Content {
  const details: [string, string][] = [
    ['Grid points', count(input.points)],
    ['Succeeded', count(input.succeeded)],
    ...(input.failed > 0 ? ([['Failed', count(input.failed)]] as [string, string][]) : []),
    ...(input.cancelled > 0 ? ([['Cancelled', count(input.cancelled)]] as [string, string][]) : []),
    ['Systems per point', count(input.systems)],
    ...(input.lowest !== null && input.highest !== null
      ? ([
          ['Lowest predicted fraction', input.lowest],
          ['Highest predicted fraction', input.highest],
        ] as [string, string][])
      : []),
  ];
  return {
    subject: `Sweep finished: ${input.sweepName}`,
    ...render({
      heading: `Your sweep ${input.sweepName} has finished`,
      paragraphs: [
        `Hello ${input.name}, every grid point of the sweep has ended and its results are stored. This is the one e-mail for the whole sweep; its points send none of their own.`,
      ],
      details,
      action: { label: 'Open the sweep', url: input.link },
      footer: `You get this because run notices are on for your account. Switch them off at ${input.settingsLink}`,
    }),
  };
}

export function emailChangeEmail(input: { name: string; oldEmail: string; link: string; expiresAt: Date }): Content {
  return {
    subject: 'Confirm your new Tidefield address',
    ...render({
      heading: 'Confirm your new e-mail address',
      paragraphs: [
        `Hello ${input.name}, you asked to use this address for your Tidefield account instead of ${input.oldEmail}.`,
        `The link works once and until ${formatUtc(input.expiresAt)}. Until it is opened, you sign in with the old address.`,
      ],
      action: { label: 'Use this address', url: input.link },
      footer: 'If you did not ask for this, ignore this e-mail: the account keeps its old address.',
    }),
  };
}

/** To a new address that was used to sign up: the link that creates the account. */
export function signUpConfirmEmail(input: { name: string; departmentName: string; link: string; expiresAt: Date }): Content {
  return {
    subject: 'Confirm your Tidefield account',
    ...render({
      heading: 'Confirm your e-mail address',
      paragraphs: [
        `Hello ${input.name}, someone (we hope you) asked for a Tidefield account with this address, with a new department called ${input.departmentName}.`,
        `Your account and the department are created when you open the link. It works once and until ${formatUtc(input.expiresAt)}.`,
      ],
      action: { label: 'Create my account', url: input.link },
      footer: 'If you did not ask for this, ignore this e-mail: no account is created unless the link is opened.',
    }),
  };
}

/** To an address that already has an account, when it was used to sign up again. */
export function signUpExistingEmail(input: { name: string; signInLink: string; resetLink: string }): Content {
  return {
    subject: 'You already have a Tidefield account',
    ...render({
      heading: 'This address already has an account',
      paragraphs: [
        `Hello ${input.name}, someone (perhaps you) tried to create a Tidefield account with this address, which already has one, so nothing was created or changed.`,
        `To use your account, sign in at ${input.signInLink}. If you have forgotten your password, ask for a new one with the button below.`,
      ],
      action: { label: 'Choose a new password', url: input.resetLink },
      footer: 'If this was not you, ignore this e-mail: your account and password stay as they are.',
    }),
  };
}
