// One membership change as a short line of plain words ("Rosa Almeida invited dev@example.com as editor"), and
// its time as day, month and 24-hour clock ("2 Dec 00:10").
import type { ActivityEntry } from '@/shared/client/api-client';

export function activityText(entry: ActivityEntry): string {
  const who = entry.actor ?? 'Someone';
  const as = entry.role ? ` as ${entry.role}` : '';
  switch (entry.action) {
    case 'invited':
      return `${who} invited ${entry.subject}${as}`;
    case 'invitation-resent':
      return `${who} sent the invitation to ${entry.subject} again`;
    case 'invitation-withdrawn':
      return `${who} withdrew the invitation to ${entry.subject}`;
    case 'joined':
      return `${entry.actor ?? entry.subject} joined${as}`;
    case 'role-changed':
      return `${who} made ${entry.subject} ${entry.role ?? 'a member'}`;
    case 'removed':
      return `${who} removed ${entry.subject}`;
  }
}

export function shortDateTime(iso: string, locale?: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '—';
  const parts = new Intl.DateTimeFormat(locale, {
    day: 'numeric',
    month: 'short',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(date);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('day')} ${part('month').replace(/\.$/, '')} ${part('hour')}:${part('minute')}`;
}
