import type { ConsentRecord } from '../../../app/core/study/records';

/** One line for the participant list: the latest consent's standing. */
export function consentSummary(consents: readonly ConsentRecord[]): string {
  if (consents.length === 0) return 'no consent';
  const latest = [...consents].sort((a, b) => b.signedAt.localeCompare(a.signedAt))[0]!;
  if (latest.withdrawal) return latest.withdrawal.scope === 'all_use' ? 'withdrawn (all use)' : 'withdrawn (future releases)';
  if (!latest.scopes.participate) return 'declined to take part';
  return latest.scopes.publicRelease ? 'consented, public release' : 'consented';
}

export const scopeLabels = {
  participate: 'Take part in the study',
  publicRelease: 'Include in an anonymized public release',
  namedCollaborators: 'Share with named collaborators only',
  recontact: 'May be contacted again',
} as const;

export const withdrawalScopeLabels = {
  all_use: 'All use of the data from now on (excluded from every later release and analysis)',
  future_releases: 'Future releases (data already released stays; no later release includes it)',
} as const;

/** A datetime-local input's value ("2026-03-01T10:05") for a moment, in local time. */
export function localInputValue(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}
