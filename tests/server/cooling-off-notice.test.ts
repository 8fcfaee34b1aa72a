import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { CalcError } from '@calc';
import {
  buildCoolingOffNotice,
  buildUnsignedCoolingOffNotice,
  formatNoticeDate,
  NOTICE_BLANK,
} from '../../server/src/contract';

// Invented demo seller (no real company or address).
const seller = {
  sellerName: 'Brightwater Comfort Works',
  sellerAddress: '14 Lantern Row\nSuite 2\nMapleford',
};

describe('right-to-cancel notice (16 CFR 429.1(a), (b))', () => {
  it('fills the transaction date, the seller and the last day computed from 429.0(g) business days', () => {
    // Wednesday before Thanksgiving 2026: Thu 26 is Thanksgiving (429.0(g)), Fri 27, Sat 28 count, Sun 29 does
    // not, Mon 30 is the third business day (429.1(a)).
    const n = buildCoolingOffNotice({ ...seller, transactionDate: '2026-11-25' });
    expect(n.lastDayToCancel).toBe('2026-11-30');
    expect(n.form.dateOfTransaction).toBe('November 25, 2026');
    const cancelHow = n.form.paragraphs.at(-1) ?? '';
    expect(cancelHow).toContain(
      'to Brightwater Comfort Works, at 14 Lantern Row, Suite 2, Mapleford NOT LATER THAN MIDNIGHT OF November 30, 2026.',
    );
  });

  it('the 429.1(a) statement names midnight of the third business day and where the form is', () => {
    // 16 CFR 429.1(a): the last sentence changes to the form's actual location when not attached.
    const attached = buildCoolingOffNotice({ ...seller, transactionDate: '2026-12-03' });
    expect(attached.statement).toMatch(
      /^You, the buyer, may cancel this transaction at any time prior to midnight of the third business day after the date of this transaction\./,
    );
    expect(attached.statement).toContain('See the attached notice of cancellation form');
    const apart = buildCoolingOffNotice({ ...seller, transactionDate: '2026-12-03', formLocation: 'accompanying' });
    expect(apart.statement).toContain('See the accompanying notice of cancellation form');
  });

  it('the form is captioned, in duplicate, 10-point bold, with the buyer’s signing part (429.1(b))', () => {
    const n = buildCoolingOffNotice({ ...seller, transactionDate: '2026-12-03' });
    expect(n.form.caption).toBe('NOTICE OF CANCELLATION');
    expect(n.form.copies).toBe(2);
    expect(n.type).toEqual({ minPoints: 10, bold: true });
    expect(n.form.paragraphs[0]).toContain('within THREE BUSINESS DAYS from the above date');
    expect(n.form.paragraphs[1]).toContain('returned within TEN BUSINESS DAYS');
    expect(n.form.paragraphs[3]).toContain('within 20 days of the date of your Notice of Cancellation');
    expect(n.form.buyerPart.sentence).toBe('I HEREBY CANCEL THIS TRANSACTION.');
  });

  it('the company’s state wording is carried as written (429.2), after the federal text', () => {
    const n = buildCoolingOffNotice({
      ...seller,
      transactionDate: '2026-12-03',
      stateWording: '  Extra state words.  ',
    });
    expect(n.stateWording).toBe('Extra state words.');
  });

  it('markup and template syntax in the seller’s name stay literal text', () => {
    const n = buildCoolingOffNotice({
      ...seller,
      sellerName: '<b>{{company}}</b> & ${x}',
      transactionDate: '2026-12-03',
    });
    expect(n.form.paragraphs.at(-1)).toContain('to <b>{{company}}</b> & ${x}, at');
  });

  it('bad input is refused, not printed: CR/LF in the name, no address, a malformed or impossible date', () => {
    expect(() =>
      buildCoolingOffNotice({ ...seller, sellerName: 'A\r\nBcc: x@example.test', transactionDate: '2026-12-03' }),
    ).toThrow(ZodError);
    expect(() => buildCoolingOffNotice({ ...seller, sellerAddress: '  ', transactionDate: '2026-12-03' })).toThrow(
      ZodError,
    );
    expect(() => buildCoolingOffNotice({ ...seller, transactionDate: '3 Dec 2026' })).toThrow(ZodError);
    expect(() => buildCoolingOffNotice({ ...seller, transactionDate: '2026-02-30' })).toThrow(CalcError);
  });

  it('before signing: the same 429.1 texts with blank lines for both dates', () => {
    const signed = buildCoolingOffNotice({ ...seller, transactionDate: '2026-11-25' });
    const unsigned = buildUnsignedCoolingOffNotice(seller);
    expect(unsigned.transactionDate).toBeNull();
    expect(unsigned.lastDayToCancel).toBeNull();
    expect(unsigned.form.dateOfTransaction).toBeNull();
    expect(unsigned.statement).toBe(signed.statement);
    expect(unsigned.form.paragraphs.slice(0, 4)).toEqual(signed.form.paragraphs.slice(0, 4));
    expect(unsigned.form.paragraphs.at(-1)).toBe(
      (signed.form.paragraphs.at(-1) ?? '').replace('November 30, 2026', NOTICE_BLANK),
    );
    expect(() => buildUnsignedCoolingOffNotice({ ...seller, sellerAddress: ' ' })).toThrow(ZodError);
  });

  it('dates print in US style without Intl', () => {
    expect(formatNoticeDate('2027-01-04')).toBe('January 4, 2027');
  });
});
