import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { proposalDetailsBody, ProposalSnapshot } from '@contract';
import { NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { assertVersion } from '../../lib/version-lock';
import type { Storage } from '../../services/storage';
import { CompanySchema } from '../companies/company.entity';
import { cleanLogo } from '../photos/image';
import { UserSchema } from '../users/user.entity';
import {
  CompanyLogoSchema,
  CompanyProposalDetailsSchema,
  type CompanyLogo,
  type CompanyProposalDetails,
} from './proposal-details.entity';
import { presentProposalDetails } from './proposal-details.presenter';

/** Logo writes also need the file storage. */
export interface LogoContext extends ServiceContext {
  readonly storage: Storage;
}

export interface ProposalDetailsView {
  readonly row: CompanyProposalDetails | null;
  readonly logo: CompanyLogo | null;
}

async function read(em: EntityManager, companyId: string): Promise<ProposalDetailsView> {
  const [row, logo] = await Promise.all([
    em.findOne(CompanyProposalDetailsSchema, { company: companyId }),
    em.findOne(CompanyLogoSchema, { company: companyId }),
  ]);
  return { row, logo };
}

export function getProposalDetails({ em, actor }: ServiceContext): Promise<ProposalDetailsView> {
  return read(em, actor.companyId);
}

/** The owner saves the whole document against the version read (none yet: 0). Bad input never reaches here. */
export async function putProposalDetails(
  { em, actor }: ServiceContext,
  version: number,
  input: ReturnType<typeof proposalDetailsBody.parse>,
): Promise<ProposalDetailsView> {
  const company = await em.findOne(CompanySchema, { id: actor.companyId });
  if (!company) throw new NotFoundError('The company');
  const { row: existing, logo } = await read(em, actor.companyId);
  assertVersion(version, existing?.version ?? 0, 'The proposal details', () => presentProposalDetails(existing, logo));
  const row = existing ?? em.create(CompanyProposalDetailsSchema, { company, ...input });
  em.assign(row, input);
  await em.flush();
  return { row, logo };
}

/** Whether an issued proposal version's frozen snapshot names this logo file (then it must stay stored). */
async function logoIsFrozen(em: EntityManager, companyId: string, storageKey: string): Promise<boolean> {
  const rows: unknown[] = await em.execute(
    `select 1 from "proposal_version" where "company_id" = ? and "snapshot"->'company'->>'logoKey' = ? limit 1`,
    [companyId, storageKey],
  );
  return rows.length > 0;
}

/** Removes a replaced logo's file unless an issued version still prints it; a failure only leaves a file behind. */
async function dropLogoFile(ctx: LogoContext, logo: CompanyLogo): Promise<void> {
  if (await logoIsFrozen(ctx.em, ctx.actor.companyId, logo.storageKey)) return;
  await ctx.storage.delete(logo.storageKey).catch(() => undefined);
}

/**
 * The owner's new logo: checked like a room photo (type by content, pixel and byte limits), re-encoded
 * to PNG, stored under a fresh key, then recorded in place of the old one (the company row locked, so two
 * uploads at once end with one logo). The old file goes unless an issued version names it.
 */
export async function setLogo(ctx: LogoContext, file: { buffer: Buffer }): Promise<ProposalDetailsView> {
  const clean = await cleanLogo(file.buffer);
  const storageKey = randomUUID();
  await ctx.storage.put(storageKey, clean.bytes, clean.contentType);
  let replaced: CompanyLogo | null = null;
  try {
    await ctx.em.transactional(async (tx) => {
      await tx.execute('select 1 from "company" where "id" = ? for update', [ctx.actor.companyId]);
      replaced = await tx.findOne(CompanyLogoSchema, { company: ctx.actor.companyId });
      if (replaced) tx.remove(replaced);
      await tx.flush();
      tx.create(CompanyLogoSchema, {
        company: ctx.actor.companyId,
        storageKey,
        contentType: clean.contentType,
        byteSize: clean.bytes.length,
        width: clean.width,
        height: clean.height,
        uploadedBy: tx.getReference(UserSchema, ctx.actor.userId),
        uploadedAt: ctx.clock.now(),
      });
      await tx.flush();
    });
  } catch (e) {
    await ctx.storage.delete(storageKey).catch(() => undefined);
    throw e;
  }
  if (replaced) await dropLogoFile(ctx, replaced);
  ctx.em.clear();
  return read(ctx.em, ctx.actor.companyId);
}

/** Takes the logo off future proposals; versions already issued keep printing theirs. */
export async function removeLogo(ctx: LogoContext): Promise<void> {
  const logo = await ctx.em.transactional(async (tx) => {
    await tx.execute('select 1 from "company" where "id" = ? for update', [ctx.actor.companyId]);
    const found = await tx.findOne(CompanyLogoSchema, { company: ctx.actor.companyId });
    if (!found) throw new NotFoundError('The logo');
    await tx.nativeDelete(CompanyLogoSchema, { id: found.id });
    return found;
  });
  await dropLogoFile(ctx, logo);
}

export async function logoBytes(ctx: LogoContext, logoId: string): Promise<{ logo: CompanyLogo; bytes: Buffer }> {
  const logo = await ctx.em.findOne(CompanyLogoSchema, { id: logoId, company: ctx.actor.companyId });
  if (!logo) throw new NotFoundError('The logo');
  const bytes = await ctx.storage.get(logo.storageKey);
  if (!bytes) throw new NotFoundError('The logo file');
  return { logo, bytes };
}

/** Whether the company has given a business address (a proposal's cancellation notice needs one: 16 CFR 429.1). */
export async function hasBusinessAddress(em: EntityManager, companyId: string): Promise<boolean> {
  const row = await em.findOne(CompanyProposalDetailsSchema, { company: companyId });
  return (row?.address.trim() ?? '') !== '';
}

/**
 * The company's part of a proposal snapshot at this moment (issuing freezes it): its name, the contact
 * lines ('' → null), the licence, the logo's storage key, terms, warranty and the extra cancellation wording.
 */
export async function proposalCompanyPart(em: EntityManager, companyId: string): Promise<ProposalSnapshot['company']> {
  // A logo change locks the company row for update; waiting here means the key read below is the one that
  // stays, and the change's clean-up (after its commit) sees this version once it is committed.
  await em.execute('select 1 from "company" where "id" = ? for share', [companyId]);
  const company = await em.findOneOrFail(CompanySchema, { id: companyId });
  const { row, logo } = await read(em, companyId);
  const orNull = (s: string | undefined) => (s && s.trim() !== '' ? s : null);
  return {
    name: company.name,
    address: orNull(row?.address),
    phone: orNull(row?.phone),
    email: orNull(row?.email),
    licence: orNull(row?.licence),
    logoKey: logo?.storageKey ?? null,
    terms: row?.terms ?? '',
    warranty: row?.warranty ?? '',
    cancellationExtra: row?.cancellationExtra ?? '',
  };
}
