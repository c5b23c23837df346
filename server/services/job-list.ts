/** The background jobs a user started, a page at a time, without their results. */
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { JobListQuery, JobSummary } from '@shared/schemas/jobs';
import { EvaluationJob } from '../models';
import { database } from '../db/sequelize';
import { afterCursor, keyAttributes, keyOrder, matchingRows, pageOf, byCreation } from './keyset';

const JOB_ORDERS = byCreation('EvaluationJob');

/**
 * One page of the user's jobs, newest first by default
 * (evaluation_jobs_user_created_idx serves both orders); `kind` and `status`
 * filter, `q` matches part of the kind or the status, starting from the trigram index of
 * that text (evaluation_jobs_search_trgm_idx) as every list's search does (matchingRows()).
 */
export async function listJobs(
  userId: string,
  query: JobListQuery & { limit: number; sort: 'newest' | 'oldest' },
  transaction: Transaction | null,
): Promise<{ items: EvaluationJob[]; nextCursor: string | null }> {
  const order = JOB_ORDERS[query.sort];
  const conditions: WhereOptions[] = [{ userId }];
  if (query.kind) conditions.push({ kind: query.kind });
  if (query.status) conditions.push({ status: query.status });
  if (query.q) {
    const user = database().escape(userId);
    conditions.push(
      await matchingRows(
        {
          model: 'EvaluationJob',
          table: 'evaluation_jobs',
          expressions: [(t) => `(${t}.kind || ' ' || ${t}.status)`],
          scope: (t) => `${t}.user_id = ${user}`,
        },
        query.q,
        transaction,
      ),
    );
  }
  if (query.cursor) conditions.push(afterCursor(order, query.cursor));
  const rows = await EvaluationJob.findAll({
    where: { [Op.and]: conditions },
    attributes: { exclude: ['input', 'result'], include: keyAttributes(order) },
    order: keyOrder(order),
    limit: query.limit + 1,
    transaction,
  });
  return pageOf(rows, query.limit, order);
}

export function presentJobSummary(job: EvaluationJob): JobSummary {
  return {
    id: job.id,
    kind: job.kind,
    status: job.status,
    progress: job.progress,
    ...(job.error ? { error: job.error } : {}),
    createdAt: job.createdAt.toISOString(),
    updatedAt: job.updatedAt.toISOString(),
  };
}
