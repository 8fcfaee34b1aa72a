import type { EntityManager } from '@mikro-orm/postgresql';
import { CANCELLED_BY_BUYER, DEFAULT_LOSS_REASONS, type LossReasonsInput, type LossReasonsRecord } from '@contract';
import { assertVersion } from '../../lib/version-lock';
import type { ServiceContext } from '../../lib/service-context';
import { CompanySchema } from '../companies/company.entity';
import { CompanyLossReasonsSchema } from './loss-reasons.entity';

/** The company's loss reasons as the screens and the job's lost mark read them (the defaults until saved). */
export async function lossReasonsOf(em: EntityManager, companyId: string): Promise<LossReasonsRecord> {
  const row = await em.findOne(CompanyLossReasonsSchema, { company: companyId });
  return row
    ? { reasons: [...row.reasons], systemReason: CANCELLED_BY_BUYER, isDefault: false, version: row.version }
    : { reasons: [...DEFAULT_LOSS_REASONS], systemReason: CANCELLED_BY_BUYER, isDefault: true, version: 0 };
}

/** The owner replaces the list (If-Match: the version read; 0 before the first save). */
export async function putLossReasons(
  { em, actor }: ServiceContext,
  version: number,
  input: LossReasonsInput,
): Promise<LossReasonsRecord> {
  const current = await lossReasonsOf(em, actor.companyId);
  assertVersion(version, current.version, 'The list of loss reasons', () => current);
  const row =
    (await em.findOne(CompanyLossReasonsSchema, { company: actor.companyId })) ??
    em.create(CompanyLossReasonsSchema, {
      company: em.getReference(CompanySchema, actor.companyId),
      reasons: input.reasons,
    });
  row.reasons = [...input.reasons];
  await em.flush();
  return lossReasonsOf(em, actor.companyId);
}
