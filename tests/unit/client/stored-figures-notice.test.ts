import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '@shared/engine/version';
import type { RevisionDetail } from '@shared/schemas/revisions';
import { storedFiguresNotice } from '@/features/review/components/review-panel';

// A revision keeps the figures its engine computed when it was saved and signed; the revision
// page recomputes the canvas with today's engine. After an upgrade the two may differ, and the
// page must say which figures are the record rather than show today's as if they were signed.
const revision = (engineVersion: string, totals: Partial<RevisionDetail['totals']> | null) =>
  ({ engineVersion, totals }) as Pick<RevisionDetail, 'engineVersion' | 'totals'>;

describe('the stored-figures notice of a revision', () => {
  it('names the earlier version and the stored figures when the engine has changed since', () => {
    const notice = storedFiguresNotice(
      revision('1.1.0', { yieldPct: 90.24, purityWtPct: 99.5, pmi: 61.7 }),
    );
    expect(notice).toContain('version 1.1.0');
    expect(notice).toContain('yield 90.2 %, purity 99.5 %, PMI 62');
    expect(notice).toContain(`today's version (${ENGINE_VERSION})`);
    expect(notice).toContain('the stored figures are the record');
  });

  it('says so when the revision could not be evaluated then', () => {
    expect(storedFiguresNotice(revision('1.0.2', null))).toContain('could not be evaluated then');
  });

  it("stays silent when the revision was computed by today's engine", () => {
    expect(
      storedFiguresNotice(revision(ENGINE_VERSION, { yieldPct: 90, purityWtPct: 99, pmi: 60 })),
    ).toBeNull();
  });
});
