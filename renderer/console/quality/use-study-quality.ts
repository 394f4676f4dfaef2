import { useEffect, useMemo, useState } from 'react';
import { activeCorrection } from '../../../app/core/quality/correction';
import { sessionQuality } from '../../../app/core/quality/session-quality';
import { useHost } from '../host-context';
import { useLabQuery } from '../lab/use-lab-query';
import { fetchSessionSeries, lateFrameTotals, type SeriesResult } from './session-series';
import { studyQualityRow, type StudyQualityRow } from './study-quality-rows';
import { limitsOf } from './use-session-quality';

/** Every session of a study with its quality figures (null while reading). */
export function useStudyQuality(studyId: string): { rows: StudyQualityRow[]; unread: string[] } | null {
  const { api } = useHost();
  const records = useLabQuery(
    ['sessions', 'participants', 'protocols', 'validations', 'exclusions', 'corrections'],
    async (store) => {
      const sessions = await store.list('sessions', { studyId });
      const [participants, protocols, validations, exclusions, corrections] = await Promise.all([
        store.list('participants', { studyId }),
        store.list('protocols', { studyId }),
        Promise.all(sessions.map((s) => store.list('validations', { sessionId: s.id }))).then((all) => all.flat()),
        Promise.all(sessions.map((s) => store.list('exclusions', { sessionId: s.id }))).then((all) => all.flat()),
        Promise.all(sessions.map((s) => store.list('corrections', { sessionId: s.id }))).then((all) => all.flat()),
      ]);
      return { sessions, participants, protocols, validations, exclusions, corrections };
    },
    [studyId],
  );
  const [series, setSeries] = useState<ReadonlyMap<string, SeriesResult>>(new Map());
  const sessionIds = records?.sessions.map((s) => s.id).join('\n') ?? '';
  useEffect(() => {
    let live = true;
    const ids = sessionIds ? sessionIds.split('\n') : [];
    void Promise.all(ids.map(async (id) => [id, await fetchSessionSeries(api, id).catch((e: Error): SeriesResult => ({ ok: false, message: e.message }))] as const)).then((pairs) => live && setSeries(new Map(pairs)));
    return () => {
      live = false;
    };
  }, [api, sessionIds]);

  return useMemo(() => {
    if (!records) return null;
    const codes = new Map(records.participants.map((p) => [p.id, p.code]));
    const unread: string[] = [];
    const rows = records.sessions.map((session) => {
      const r = series.get(session.id);
      if (!r?.ok) unread.push(session.id);
      const s = r?.ok ? r.series : null;
      const protocol = records.protocols.find((p) => p.id === session.protocolId) ?? null;
      const q = sessionQuality({ session, validations: records.validations, firstSampleHostNs: s?.firstSampleHostNs ?? null, dataLoss: s?.dataLoss ?? null, lateFrames: lateFrameTotals(s), thresholds: limitsOf(protocol) });
      const excluded = records.exclusions.some((e) => e.sessionId === session.id && e.scope.kind === 'session' && e.revokedAt === null);
      const corrected = activeCorrection(records.corrections, session.id) !== null;
      return studyQualityRow(q, codes.get(session.participantId) ?? session.participantId, session.startedAt, { excluded, corrected });
    });
    return { rows, unread };
  }, [records, series]);
}
