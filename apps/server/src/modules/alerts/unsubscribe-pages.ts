import { alertKindLabels, type AlertKind } from '@lotwise/shared';
import { escapeHtml, htmlDocument } from './messages';

/** A page a person sees after following an unsubscribe link: status, title and HTML. */
export interface UnsubscribePage {
  status: number;
  title: string;
  html: string;
}

const text = {
  paragraph: 'margin:0 0 12px 0;',
  heading: 'font-size:20px;margin:0 0 12px 0;',
  button:
    'font:inherit;font-weight:bold;padding:10px 16px;background:#1d4ed8;color:#ffffff;border:none;border-radius:4px;cursor:pointer;',
  note: 'margin:16px 0 0 0;padding:10px 12px;background:#f0f4f8;border-left:4px solid #52606d;',
};

function page(status: number, title: string, parts: string[]): UnsubscribePage {
  const body = [`<h1 style="${text.heading}">${escapeHtml(title)}</h1>`, ...parts].join('');
  return { status, title, html: htmlDocument(title, body) };
}

const p = (html: string) => `<p style="${text.paragraph}">${html}</p>`;

/** "about: low stock" or "from Lotwise" for all kinds, as plain text. */
function what(kind: AlertKind | 'all'): string {
  return kind === 'all'
    ? 'all alert e-mails from Lotwise'
    : `e-mails about: ${alertKindLabels[kind].toLowerCase()}`;
}

const stillOnAlertsPage =
  'Current alerts (low stock, expiry, peroxide tests, reservations) stay on the Alerts page in Lotwise whether or not you get e-mails.';

const settingsLink = (url: string, label = 'Alert settings') =>
  p(`<a href="${escapeHtml(url)}">${escapeHtml(label)}</a>`);

/** The answer to a link that is not one Lotwise signed (or whose person is gone). */
export function brokenLinkPage(preferencesUrl: string): UnsubscribePage {
  return page(400, 'This unsubscribe link does not work', [
    p(
      'The link is incomplete or was changed. Open it again from the e-mail, or sign in to Lotwise and change your alert settings.',
    ),
    settingsLink(preferencesUrl),
  ]);
}

/**
 * What opening the link shows: what it would stop and for which address, and a button that
 * posts to the same link. Opening it changes nothing, so a mail scanner that follows every
 * link cannot switch off someone's safety alerts.
 */
export function confirmPage(input: {
  kind: AlertKind | 'all';
  email: string;
  alreadyOff: boolean;
  /** Path of the link itself (with its token); the form posts there. */
  actionPath: string;
  preferencesUrl: string;
}): UnsubscribePage {
  if (input.alreadyOff) {
    return page(200, 'Already unsubscribed', [
      p(`${escapeHtml(input.email)} already gets no ${escapeHtml(what(input.kind))}.`),
      p(stillOnAlertsPage),
      settingsLink(input.preferencesUrl),
    ]);
  }
  const label = input.kind === 'all' ? 'Stop all alert e-mails' : `Stop ${what(input.kind)}`;
  return page(200, 'Stop these e-mails?', [
    p(
      `This link stops ${escapeHtml(what(input.kind))} for <strong>${escapeHtml(input.email)}</strong>. Nothing has changed yet.`,
    ),
    `<form method="post" action="${escapeHtml(input.actionPath)}" style="${text.paragraph}">`,
    '<input type="hidden" name="List-Unsubscribe" value="One-Click">',
    `<button type="submit" style="${text.button}">${escapeHtml(label)}</button>`,
    '</form>',
    p(`<span style="display:block;${text.note}">${escapeHtml(stillOnAlertsPage)}</span>`),
    settingsLink(input.preferencesUrl, 'Keep the e-mails, or choose which ones, in alert settings'),
  ]);
}

/** The answer once the POST has unsubscribed. */
export function unsubscribedPage(input: {
  kind: AlertKind | 'all';
  email: string;
  preferencesUrl: string;
}): UnsubscribePage {
  return page(200, 'Unsubscribed', [
    p(`You will get no more ${escapeHtml(what(input.kind))}. (${escapeHtml(input.email)})`),
    p(`${stillOnAlertsPage} You can turn e-mails back on in your alert settings.`),
    settingsLink(input.preferencesUrl),
  ]);
}
