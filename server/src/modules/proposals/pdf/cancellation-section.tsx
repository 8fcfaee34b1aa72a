import { Text, View } from '@react-pdf/renderer';
import {
  buildCoolingOffNotice,
  buildUnsignedCoolingOffNotice,
  COOLING_OFF_TYPE,
  NOTICE_BLANK,
  type CoolingOffNotice,
  type ProposalSnapshot,
} from '@contract';
import { FONT_WEIGHTS } from './fonts';
import { line, paragraphs } from './format';
import { COLORS, s } from './styles';

/**
 * The buyer's right to cancel a sale made at the home (FTC Cooling-Off Rule, 16 CFR 429.1), laid out from
 * the contract's `buildCoolingOffNotice` texts: the 429.1(a) statement beside the buyer's signature (the
 * acceptance page places `CancelStatement`), and the 429.1(b) Notice of Cancellation in duplicate, one copy
 * a page, with the company's extra state wording after the federal form. Both in bold type of at least 10
 * points (`COOLING_OFF_TYPE`).
 */

/** When and where the buyer signed: the job site's local date of the signing (the signing slice passes it). */
export interface CancellationDates {
  readonly transactionDate: string;
}

/** The sizes the rule's texts print at: never below its 10-point minimum. */
const NOTICE_POINTS = Math.max(COOLING_OFF_TYPE.minPoints, 10.5);

/**
 * The notice for a version: with the transaction date when the buyer has signed (the last day to cancel is
 * computed from it), blank lines for both dates before that. The seller is the company as the snapshot froze
 * it; with no address in the settings the form prints a blank line for it.
 */
export function noticeForSnapshot(
  company: ProposalSnapshot['company'],
  signed: CancellationDates | null,
): CoolingOffNotice {
  const parties = {
    sellerName: line(company.name).trim() || NOTICE_BLANK,
    sellerAddress: company.address?.trim() ? company.address : NOTICE_BLANK,
    stateWording: company.cancellationExtra,
  };
  return signed
    ? buildCoolingOffNotice({ ...parties, transactionDate: signed.transactionDate })
    : buildUnsignedCoolingOffNotice(parties);
}

const bold = { fontSize: NOTICE_POINTS, fontWeight: FONT_WEIGHTS.bold, lineHeight: 1.35 } as const;

/** The 429.1(a) statement, in a box, for the acceptance page just above the buyer's signature lines. */
export function CancelStatement({ notice }: { notice: CoolingOffNotice }) {
  return (
    <View wrap={false} style={{ borderWidth: 1, borderColor: COLORS.ink, padding: 8, marginTop: 4, marginBottom: 12 }}>
      <Text style={[bold, { color: COLORS.ink }]}>{line(notice.statement)}</Text>
    </View>
  );
}

function FillLine({ value, label, width }: { value: string | null; label: string; width: string }) {
  return (
    <View style={{ width, paddingRight: 18 }}>
      <View
        style={{ borderBottomWidth: 0.9, borderBottomColor: COLORS.text, minHeight: 24, justifyContent: 'flex-end' }}
      >
        {value ? <Text style={[bold, { paddingBottom: 2 }]}>{line(value)}</Text> : null}
      </View>
      <Text style={[bold, { marginTop: 2 }]}>{label}</Text>
    </View>
  );
}

/** One copy of the 429.1(b) form (the rule asks for two), then the company's state wording and the source. */
export function NoticeOfCancellation({
  notice,
  copy,
  companyName,
}: {
  notice: CoolingOffNotice;
  copy: 1 | 2;
  companyName: string;
}) {
  const extra = paragraphs(notice.stateWording);
  return (
    <View>
      <Text style={[s.small, { marginBottom: 10 }]}>
        {copy === 1
          ? 'Copy 1 of 2: keep this copy for your records.'
          : 'Copy 2 of 2: to cancel, sign and date this copy and send or deliver it as it says.'}
      </Text>
      <Text style={{ fontSize: 15, fontWeight: FONT_WEIGHTS.bold, color: COLORS.ink, textAlign: 'center' }}>
        {notice.form.caption}
      </Text>
      <View style={{ flexDirection: 'row', marginTop: 14, marginBottom: 14 }}>
        <FillLine value={notice.form.dateOfTransaction} label="(Date)" width="50%" />
      </View>
      {notice.form.paragraphs.map((p, i) => (
        <Text key={i} style={[bold, { marginBottom: 7 }]}>
          {line(p)}
        </Text>
      ))}
      <Text style={[bold, { marginTop: 10 }]}>{notice.form.buyerPart.sentence}</Text>
      <View style={{ flexDirection: 'row', marginTop: 14 }}>
        <FillLine value={null} label={notice.form.buyerPart.blanks[0]} width="35%" />
        <FillLine value={null} label={notice.form.buyerPart.blanks[1]} width="65%" />
      </View>
      {notice.transactionDate === null ? (
        <Text style={[s.small, { marginTop: 12 }]}>
          The date of the transaction and the last day to cancel are filled in when you sign.
        </Text>
      ) : null}
      {extra.length > 0 ? (
        <View style={{ marginTop: 16, borderTopWidth: 0.75, borderTopColor: COLORS.inkLine, paddingTop: 8 }}>
          <Text style={[bold, { color: COLORS.ink, marginBottom: 4 }]}>
            {`Further cancellation terms from ${line(companyName)}`}
          </Text>
          {extra.map((p, i) => (
            <Text key={i} style={[bold, { marginBottom: 5 }]}>
              {p}
            </Text>
          ))}
        </View>
      ) : null}
      <Text style={[s.small, { marginTop: 14 }]}>{notice.source}</Text>
    </View>
  );
}
