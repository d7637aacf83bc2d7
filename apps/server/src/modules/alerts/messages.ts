import {
  alertKindLabels,
  formatDate,
  formatDateTime,
  formatQuantity,
  ghsPictograms,
  hazardStatementTexts,
  safetyDeferral,
  type AlertKind,
} from '@lotwise/shared';
import type { TextConfig } from '../../config';
import type { AlertContainerFacts } from './alerts.repository';
import type { Condition, ConditionChemical, MailTopic } from './rules';

/** The content of one e-mail, before the footer is added at sending time. */
export interface MessageContent {
  subject: string;
  text: string;
  /** An HTML fragment (no <html> wrapper); inline styles only, no images. */
  html: string;
  /** Full address of the page it is about. */
  link: string;
}

export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

const styles = {
  body: 'font-family:Arial,Helvetica,sans-serif;font-size:15px;line-height:1.45;color:#1f2933;',
  heading: 'font-size:18px;margin:0 0 12px 0;color:#102a43;',
  subheading: 'font-size:15px;margin:16px 0 8px 0;color:#102a43;',
  list: 'margin:0 0 12px 0;padding-left:20px;',
  paragraph: 'margin:0 0 12px 0;',
  table: 'border-collapse:collapse;margin:0 0 12px 0;',
  cell: 'border:1px solid #d9e2ec;padding:4px 8px;text-align:left;vertical-align:top;',
  head: 'border:1px solid #d9e2ec;padding:4px 8px;text-align:left;background:#f0f4f8;',
  button:
    'display:inline-block;padding:8px 14px;background:#1d4ed8;color:#ffffff;text-decoration:none;border-radius:4px;',
  small: 'font-size:12px;color:#52606d;margin:12px 0 0 0;',
  rule: 'border:none;border-top:1px solid #d9e2ec;margin:20px 0;',
};

function amount(value: number, unit: 'g' | 'mL'): string {
  return formatQuantity(value, unit);
}

function containerLine(container: AlertContainerFacts, extra = ''): string {
  return `${container.labelCode} · ${amount(container.quantity, container.unit)} · ${container.locationPath}${extra}`;
}

/** "H225 Highly flammable liquid and vapour." — or a pointer to the SDS for a code not held. */
function hazardStatementLine(code: string): string {
  const text = hazardStatementTexts[code];
  return text ? `${code} ${text}.` : `${code} (text not held in Lotwise: see the SDS)`;
}

function pictogramsLine(chemical: ConditionChemical): string | null {
  const pictograms = chemical.ghsPictograms.map(
    (code) => `${code} (${ghsPictograms[code]?.meaning ?? code})`,
  );
  return pictograms.length ? `GHS pictograms: ${pictograms.join('; ')}.` : null;
}

function hazardLines(chemical: ConditionChemical): string[] {
  const pictograms = pictogramsLine(chemical);
  return [
    `Hazards of ${chemical.name}:`,
    ...(pictograms ? [pictograms] : []),
    ...(chemical.hazardStatements.length
      ? chemical.hazardStatements.map((code) => `- ${hazardStatementLine(code)}`)
      : ['No hazard statements recorded: check the SDS.']),
    safetyDeferral,
  ];
}

function containerTable(rows: { cells: string[] }[], headings: string[]): string {
  const head = headings.map((h) => `<th style="${styles.head}">${escapeHtml(h)}</th>`).join('');
  const body = rows
    .map(
      (row) =>
        `<tr>${row.cells.map((cell) => `<td style="${styles.cell}">${escapeHtml(cell)}</td>`).join('')}</tr>`,
    )
    .join('');
  return `<table role="presentation" style="${styles.table}"><tr>${head}</tr>${body}</table>`;
}

function openButton(link: string, label: string): string {
  return `<p style="${styles.paragraph}"><a href="${escapeHtml(link)}" style="${styles.button}">${escapeHtml(label)}</a></p>`;
}

function paragraphs(lines: string[]): string {
  return lines.map((line) => `<p style="${styles.paragraph}">${escapeHtml(line)}</p>`).join('');
}

function hazardHtml(chemical: ConditionChemical): string {
  const pictograms = pictogramsLine(chemical);
  const statements = chemical.hazardStatements.length
    ? `<ul style="${styles.list}">${chemical.hazardStatements
        .map((code) => `<li>${escapeHtml(hazardStatementLine(code))}</li>`)
        .join('')}</ul>`
    : paragraphs(['No hazard statements recorded: check the SDS.']);
  return [
    `<h2 style="${styles.subheading}">${escapeHtml(`Hazards of ${chemical.name}`)}</h2>`,
    pictograms ? paragraphs([pictograms]) : '',
    statements,
    `<p style="${styles.small}">${escapeHtml(safetyDeferral)}</p>`,
  ].join('');
}

function lowStockMessage(topic: MailTopic, publicUrl: string): MessageContent {
  const condition = topic.conditions[0]!;
  const stock = condition.stock!;
  const chemical = topic.chemical;
  const left = amount(stock.total, stock.unit);
  const point = amount(stock.reorderPoint, stock.unit);
  const out = topic.severity === 'critical';
  const link = `${publicUrl}/stock/chemicals/${chemical.id}`;
  const subject = out
    ? `Out of stock: ${chemical.name} (reorder point ${point})`
    : `Low stock: ${chemical.name} — ${left} left (reorder point ${point})`;
  const intro = out
    ? `${chemical.name} has no usable stock left. Its reorder point is ${point}.`
    : `${chemical.name} is at or below its reorder point: ${left} usable, reorder point ${point}.`;
  const facts = [
    `Usable stock: ${left}`,
    `Reorder point: ${point}`,
    ...(stock.reorderQuantity !== null
      ? [`Usual reorder quantity: ${amount(stock.reorderQuantity, stock.unit)}`]
      : []),
  ];
  const containers = stock.containers;
  const text = [
    intro,
    '',
    ...facts,
    '',
    containers.length ? 'Usable containers:' : 'No usable containers are left.',
    ...containers.map((c) => `- ${containerLine(c)}`),
    '',
    `Open in Lotwise: ${link}`,
    '',
    ...hazardLines(chemical),
  ].join('\n');
  const html = [
    `<h1 style="${styles.heading}">${escapeHtml(subject)}</h1>`,
    paragraphs([intro]),
    containerTable(
      facts.map((f) => ({ cells: f.split(': ') })),
      ['', chemical.name],
    ),
    containers.length
      ? containerTable(
          containers.map((c) => ({
            cells: [c.labelCode, amount(c.quantity, c.unit), c.locationPath],
          })),
          ['Label', 'Amount', 'Location'],
        )
      : paragraphs(['No usable containers are left.']),
    openButton(link, `Open ${chemical.name} in Lotwise`),
    hazardHtml(chemical),
  ].join('');
  return { subject, text, html, link };
}

const datedWording: Record<
  'expiring' | 'expired' | 'peroxide-due',
  { subject: string; intro: string; column: string }
> = {
  expiring: {
    subject: 'Expiring soon',
    intro: 'These containers reach their expiry date soon:',
    column: 'Expires on',
  },
  expired: {
    subject: 'Expired',
    intro:
      'These containers are past their expiry date. Check them, then dispose of them or record a new date:',
    column: 'Expired on',
  },
  'peroxide-due': {
    subject: 'Peroxide test or discard due',
    intro: 'These containers of a peroxide former are due a peroxide test or disposal:',
    column: 'Test or discard by',
  },
};

function datedMessage(topic: MailTopic, publicUrl: string, style: TextConfig): MessageContent {
  const wording = datedWording[topic.kind as keyof typeof datedWording];
  const chemical = topic.chemical;
  const containers = topic.conditions.map((c) => c.container!);
  const single = containers.length === 1 ? containers[0]! : null;
  const link = single
    ? `${publicUrl}/stock/containers/${single.id}`
    : `${publicUrl}/stock/chemicals/${chemical.id}`;
  const overdue = topic.kind === 'peroxide-due' && topic.severity === 'critical';
  const subject = `${overdue ? 'Peroxide test overdue' : wording.subject}: ${chemical.name} — ${
    single ? single.labelCode : `${containers.length} containers`
  }`;
  const due = (c: Condition) => (c.dueOn ? formatDate(c.dueOn, style) : '');
  const dateNote = (c: Condition) =>
    c.kind === 'peroxide-due' && c.severity === 'critical' ? ' (overdue)' : '';
  const text = [
    `${chemical.name}: ${wording.intro}`,
    '',
    ...topic.conditions.map(
      (c) =>
        `- ${containerLine(c.container!)} · ${wording.column.toLowerCase()} ${due(c)}${dateNote(c)}`,
    ),
    '',
    `Open in Lotwise: ${link}`,
    '',
    ...hazardLines(chemical),
  ].join('\n');
  const html = [
    `<h1 style="${styles.heading}">${escapeHtml(subject)}</h1>`,
    paragraphs([`${chemical.name}: ${wording.intro}`]),
    containerTable(
      topic.conditions.map((c) => ({
        cells: [
          c.container!.labelCode,
          amount(c.container!.quantity, c.container!.unit),
          c.container!.locationPath,
          `${due(c)}${dateNote(c)}`,
        ],
      })),
      ['Label', 'Amount', 'Location', wording.column],
    ),
    openButton(link, single ? `Open ${single.labelCode} in Lotwise` : `Open ${chemical.name}`),
    hazardHtml(chemical),
  ].join('');
  return { subject, text, html, link };
}

function reservationMessage(
  topic: MailTopic,
  publicUrl: string,
  style: TextConfig,
): MessageContent {
  const r = topic.conditions[0]!.reservation!;
  const link = `${publicUrl}/preparations/plans/${r.planId}`;
  const subject = `Reservation lapsing: ${r.chemicalName} for ${r.planTitle}`;
  const line = `${r.labelCode} · ${amount(r.quantity, r.unit)} reserved · ${r.locationPath} · lapses ${formatDateTime(r.lapsesAt, { ...style, showZone: true })}`;
  const intro = `Your reservation of ${r.chemicalName} for “${r.planTitle}” lapses soon; after that the stock is free for others.`;
  const text = [
    intro,
    '',
    `- ${line}`,
    '',
    `Open the plan: ${link}`,
    '',
    ...hazardLines(topic.chemical),
  ].join('\n');
  const html = [
    `<h1 style="${styles.heading}">${escapeHtml(subject)}</h1>`,
    paragraphs([intro, line]),
    openButton(link, 'Open the plan in Lotwise'),
    hazardHtml(topic.chemical),
  ].join('');
  return { subject, text, html, link };
}

/** The e-mail for one topic found by the rules. */
export function topicMessage(
  topic: MailTopic,
  publicUrl: string,
  style: TextConfig,
): MessageContent {
  if (topic.kind === 'low-stock') return lowStockMessage(topic, publicUrl);
  if (topic.kind === 'reservation-lapsing') return reservationMessage(topic, publicUrl, style);
  return datedMessage(topic, publicUrl, style);
}

/** HTML for a message given as plain text only: paragraphs, escaped. */
export function textToHtml(subject: string, text: string, link: string | null): string {
  const blocks = text
    .split(/\n{2,}/)
    .map((block) => block.split('\n').map(escapeHtml).join('<br>'));
  return [
    `<h1 style="${styles.heading}">${escapeHtml(subject)}</h1>`,
    ...blocks.map((block) => `<p style="${styles.paragraph}">${block}</p>`),
    link ? openButton(link, 'Open in Lotwise') : '',
  ].join('');
}

export interface FooterLinks {
  /** Unsubscribe from one kind (by its link), or from everything. */
  unsubscribe: { kind: AlertKind | 'all'; label: string; url: string }[];
  preferencesUrl: string;
}

/** The footer every e-mail ends with: why it came and how to stop it. */
export function footer(links: FooterLinks): { text: string; html: string } {
  const text = [
    '--',
    'You get this from Lotwise because of your alert settings.',
    ...links.unsubscribe.map((u) => `${u.label}: ${u.url}`),
    `Change what you get: ${links.preferencesUrl}`,
  ].join('\n');
  const html = [
    `<hr style="${styles.rule}">`,
    `<p style="${styles.small}">You get this from Lotwise because of your alert settings.</p>`,
    ...links.unsubscribe.map(
      (u) =>
        `<p style="${styles.small}"><a href="${escapeHtml(u.url)}" style="color:#52606d;">${escapeHtml(u.label)}</a></p>`,
    ),
    `<p style="${styles.small}"><a href="${escapeHtml(links.preferencesUrl)}" style="color:#52606d;">Change what you get</a></p>`,
  ].join('');
  return { text, html };
}

/** A complete HTML document around a fragment, readable in any mail client. */
export function htmlDocument(title: string, fragment: string): string {
  return `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(title)}</title></head><body style="margin:0;padding:16px;background:#ffffff;"><div style="${styles.body}max-width:640px;">${fragment}</div></body></html>`;
}

/** One e-mail holding several queued messages of one person. */
export function digestContent(
  parts: { kind: string; subject: string; text: string; html: string }[],
): { subject: string; text: string; html: string } {
  const subject = `Lotwise daily digest: ${parts.length} alert${parts.length === 1 ? '' : 's'}`;
  const text = [
    `${parts.length} alert${parts.length === 1 ? '' : 's'} since the last digest:`,
    ...parts.map((p, i) => `${i + 1}. ${p.subject}`),
    '',
    ...parts.map((p) => `==== ${p.subject} ====\n\n${p.text}\n`),
  ].join('\n');
  const html = [
    `<h1 style="${styles.heading}">${escapeHtml(subject)}</h1>`,
    `<ol style="${styles.paragraph}">${parts.map((p) => `<li>${escapeHtml(p.subject)}</li>`).join('')}</ol>`,
    ...parts.map((p) => `<hr style="${styles.rule}">${p.html}`),
  ].join('');
  return { subject, text, html };
}

export function kindLabel(kind: string): string {
  return alertKindLabels[kind as AlertKind] ?? kind;
}
