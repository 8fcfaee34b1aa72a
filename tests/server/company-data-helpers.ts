import type { EntityManager } from '@mikro-orm/postgresql';
import { expect } from 'vitest';
import type { Session } from '../helpers/fixtures';
import { CompanySchema } from '../../server/src/modules/companies/company.entity';
import { seedCompanyData } from '../../fixtures/seed-company-data';

export const BASE = '/api/company-data';

export const put = (s: Session, url: string, version?: number) => {
  const r = s.agent.put(url).set('X-CSRF-Token', s.csrf);
  return version === undefined ? r : r.set('If-Match', `"${version}"`);
};

/** The demo catalog and price book in a test company. */
export async function seedData(em: EntityManager, companyId: string): Promise<void> {
  seedCompanyData(em, em.getReference(CompanySchema, companyId));
  await em.flush();
}

/** A CSV body as text: header plus rows, CRLF. */
export const csvText = (rows: string[][]) =>
  rows.map((r) => r.map((c) => (/[",\r\n]/.test(c) ? `"${c.replace(/"/g, '""')}"` : c)).join(',')).join('\r\n');

/** Downloads a table's export as text, stripped of its BOM. */
export async function exportText(s: Session, dataset: string): Promise<string> {
  const r = await s.agent
    .get(`${BASE}/${dataset}/csv/export`)
    .buffer(true)
    .parse((res, cb) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => (text += c));
      res.on('end', () => cb(null, text));
    });
  expect(r.status).toBe(200);
  expect(String(r.headers['content-type'])).toMatch(/^text\/csv/);
  return String(r.body);
}
