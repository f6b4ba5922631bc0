import type { UnsubscribeScope } from '../../src/shared/schemas/following';
import type { Config } from '../config';
import type { QueuedEmail } from './outbox';
import { unsubscribeToken } from './unsubscribe-tokens';

/** The preferences page, where every kind of notice can be changed. */
export const NOTICE_SETTINGS_PATH = '/account/notices';

export interface NoticeMailInput {
  to: string;
  userId: number;
  /** What the one-click unsubscribe link stops; without one (a membership notice) the mail has no such link. */
  scope?: UnsubscribeScope;
  kind: string;
  subject: string;
  /** Plain paragraphs, in order. */
  paragraphs: string[];
  /** Links shown after the paragraphs: site paths, made absolute here. */
  links: Array<{ label: string; path: string }>;
  /** Why the person gets this, one sentence. */
  reason: string;
}

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A notice e-mail: plain text and HTML parts, absolute links, one-click unsubscribe headers. */
export function noticeMail(config: Pick<Config, 'PUBLIC_URL' | 'SESSION_SECRET'>, m: NoticeMailInput): QueuedEmail {
  const base = config.PUBLIC_URL.replace(/\/$/, '');
  const abs = (p: string) => `${base}${p}`;
  const settingsUrl = abs(NOTICE_SETTINGS_PATH);
  const text = [
    ...m.paragraphs,
    ...m.links.map((l) => `${l.label}: ${abs(l.path)}`),
    '-- ',
    m.scope ? `${m.reason} Change what we send you: ${settingsUrl}` : m.reason,
  ].join('\n\n');
  const html = [
    ...m.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    ...m.links.map((l) => `<p><a href="${escapeHtml(abs(l.path))}">${escapeHtml(l.label)}</a></p>`),
    m.scope
      ? `<hr><p style="color:#66625B;font-size:13px">${escapeHtml(m.reason)} <a href="${escapeHtml(settingsUrl)}">Change what we send you</a>.</p>`
      : `<hr><p style="color:#66625B;font-size:13px">${escapeHtml(m.reason)}</p>`,
  ].join('\n');
  if (!m.scope) return { to: m.to, subject: m.subject, text, html, kind: m.kind };
  const token = unsubscribeToken(config.SESSION_SECRET, m.userId, m.scope);
  const unsubscribeUrl = abs(`/api/unsubscribe?u=${m.userId}&s=${m.scope}&t=${token}`);
  return {
    to: m.to,
    subject: m.subject,
    text,
    html,
    kind: m.kind,
    headers: { 'List-Unsubscribe': `<${unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
  };
}
