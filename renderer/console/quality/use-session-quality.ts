import { useEffect, useMemo, useState } from 'react';
import { DEFAULT_QUALITY_LIMITS, sessionQuality, type SessionQuality } from '../../../app/core/quality/session-quality';
import type { CorrectionRecord, ProtocolRecord, RecordOf, SessionRecord, ValidationRecord } from '../../../app/core/study/records';
import { useHost } from '../host-context';
import { useLabQuery } from '../lab/use-lab-query';
import { fetchSessionSeries, lateFrameTotals, type SeriesResult } from './session-series';

export interface SessionRecords {
  readonly session: SessionRecord;
  readonly participantCode: string;
  readonly protocol: ProtocolRecord | null;
  /** Validations and drift checks, in time order. */
  readonly validations: ValidationRecord[];
  readonly exclusions: RecordOf<'exclusions'>[];
  readonly corrections: CorrectionRecord[];
  readonly clips: { stimulusId: string; name: string }[];
}

/** The protocol's thresholds, with Gazeloom's data-loss limit added. */
export const limitsOf = (protocol: ProtocolRecord | null) => ({
  validationMeanDeg: protocol?.thresholds.validationMeanDeg ?? 1,
  validationMaxDeg: protocol?.thresholds.validationMaxDeg ?? 1.5,
  driftDeg: protocol?.thresholds.driftDeg ?? 1.5,
  dataLossPct: DEFAULT_QUALITY_LIMITS.dataLossPct,
});

/** One session's records, re-read whenever one of them changes. */
export function useSessionRecords(sessionId: string): SessionRecords | null | undefined {
  return useLabQuery(
    ['sessions', 'validations', 'protocols', 'participants', 'exclusions', 'corrections', 'trials', 'stimuli'],
    async (store) => {
      const session = await store.get('sessions', sessionId);
      if (!session) return undefined;
      const [validations, protocol, participant, exclusions, corrections, trials, stimuli] = await Promise.all([
        store.list('validations', { sessionId }),
        store.get('protocols', session.protocolId),
        store.get('participants', session.participantId),
        store.list('exclusions', { sessionId }),
        store.list('corrections', { sessionId }),
        store.list('trials', { sessionId }),
        store.list('stimuli', { studyId: session.studyId }),
      ]);
      const names = new Map(stimuli.map((s) => [s.id, s.name]));
      const clipIds = [...new Set(trials.filter((t) => t.kind === 'clip' && t.stimulusId).map((t) => t.stimulusId!))];
      return {
        session,
        participantCode: participant?.code ?? session.participantId,
        protocol: protocol ?? null,
        validations: validations.sort((a, b) => a.hostNs - b.hostNs),
        exclusions: exclusions.sort((a, b) => a.decidedAt.localeCompare(b.decidedAt)),
        corrections: corrections.sort((a, b) => a.createdAt.localeCompare(b.createdAt)),
        clips: clipIds.map((id) => ({ stimulusId: id, name: names.get(id) ?? id })),
      };
    },
    [sessionId],
  );
}

/** What the host reads from the session's recording (null while it reads). */
export function useSessionSeries(sessionId: string): SeriesResult | null {
  const { api } = useHost();
  const [series, setSeries] = useState<SeriesResult | null>(null);
  useEffect(() => {
    let live = true;
    setSeries(null);
    fetchSessionSeries(api, sessionId, true)
      .then((r) => live && setSeries(r))
      .catch((error: unknown) => live && setSeries({ ok: false, message: (error as Error).message }));
    return () => {
      live = false;
    };
  }, [api, sessionId]);
  return series;
}

/** The session's figures (app/core/quality/session-quality): the same object `gazeloom quality` prints. */
export function useSessionQuality(records: SessionRecords | null | undefined, series: SeriesResult | null): SessionQuality | null {
  return useMemo(() => {
    if (!records || !series) return null;
    const s = series.ok ? series.series : null;
    return sessionQuality({
      session: records.session,
      validations: records.validations,
      firstSampleHostNs: s?.firstSampleHostNs ?? null,
      dataLoss: s?.dataLoss ?? null,
      lateFrames: lateFrameTotals(s),
      thresholds: limitsOf(records.protocol),
    });
  }, [records, series]);
}
