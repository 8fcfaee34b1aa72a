import { Text, View } from '@react-pdf/renderer';
import type { CoolingOffNotice, ProposalSnapshot } from '@contract';
import { CancelStatement } from './cancellation-section';
import { line, money } from './format';
import { Bullets, Paragraphs } from './parts';
import { COLORS, s } from './styles';

/** The company's terms and warranty, as its owner wrote them in the settings at issue time. */
export function TermsSection({ company }: { company: ProposalSnapshot['company'] }) {
  const name = line(company.name);
  return (
    <View>
      <Text style={s.h1}>Terms and warranty</Text>
      <Text style={s.h2}>Terms</Text>
      <Paragraphs text={company.terms} empty={`${name} has not added terms to this proposal.`} />
      <Text style={s.h2}>Warranty</Text>
      <Paragraphs text={company.warranty} empty={`${name} has not added warranty terms to this proposal.`} />
    </View>
  );
}

/** The safety cautions (DESIGN.md "Safety"), as calc words them, in a box that stands out from the terms. */
export function CautionsSection({ cautions }: { cautions: readonly string[] }) {
  if (cautions.length === 0) return null;
  return (
    <View wrap={false}>
      <Text style={s.h2}>Safety</Text>
      <View style={s.caution}>
        <Text style={s.cautionTitle}>Please read before the work begins</Text>
        <Bullets items={cautions.map(line)} />
      </View>
    </View>
  );
}

function Box() {
  return (
    <View
      style={{ width: 10, height: 10, borderWidth: 0.9, borderColor: COLORS.ink, marginRight: 8, marginTop: 1.5 }}
    />
  );
}

function SignLine({ label, width }: { label: string; width: number | string }) {
  return (
    <View style={{ width, paddingRight: 16 }}>
      <View style={{ borderBottomWidth: 0.9, borderBottomColor: COLORS.text, height: 30 }} />
      <Text style={[s.small, { marginTop: 3 }]}>{label}</Text>
    </View>
  );
}

/**
 * The acceptance page: the option chosen, then blank lines for the buyer and the company to sign and date,
 * with the buyer's right-to-cancel statement just above the buyer's lines (16 CFR 429.1(a): "in immediate
 * proximity to the space reserved in the contract for the signature of the buyer").
 */
export function SignaturePage({
  snapshot,
  versionNumber,
  notice,
}: {
  snapshot: ProposalSnapshot;
  versionNumber: number;
  notice: CoolingOffNotice;
}) {
  const company = line(snapshot.company.name);
  return (
    <View>
      <Text style={s.h1}>Acceptance</Text>
      <Text style={s.p}>
        {`To accept this proposal (version ${versionNumber}), tick the one option you choose, then sign and date below. By signing you agree to the work and price of that option and to the terms and warranty in this proposal.`}
      </Text>
      <View style={{ marginTop: 10, marginBottom: 14 }}>
        {snapshot.options.map((o) => (
          <View key={o.position} style={{ flexDirection: 'row', marginBottom: 8 }} wrap={false}>
            <Box />
            <Text style={{ flex: 1 }}>{`Option ${o.position}: ${line(o.name)}`}</Text>
            <Text style={s.strong}>{money(o.price.totalCents)}</Text>
            <Text style={[s.small, { width: 150, textAlign: 'right' }]}>
              {`deposit ${money(o.price.depositCents)}`}
            </Text>
          </View>
        ))}
      </View>

      <Text style={s.h2}>Buyer</Text>
      <CancelStatement notice={notice} />
      <View style={{ flexDirection: 'row', marginBottom: 14 }}>
        <SignLine label="Signature" width="60%" />
        <SignLine label="Date" width="40%" />
      </View>
      <View style={{ flexDirection: 'row', marginBottom: 14 }}>
        <SignLine label="Name in capitals" width="60%" />
      </View>

      <Text style={s.h2}>{`For ${company}`}</Text>
      <View style={{ flexDirection: 'row', marginBottom: 14 }}>
        <SignLine label="Signature" width="60%" />
        <SignLine label="Date" width="40%" />
      </View>
      <View style={{ flexDirection: 'row' }}>
        <SignLine label="Name and position" width="60%" />
      </View>
    </View>
  );
}
