import { Image, Text, View } from '@react-pdf/renderer';
import type { CoolingOffNotice, ProposalSnapshot } from '@contract';
import { CancelStatement } from './cancellation-section';
import { line, money } from './format';
import type { SignedRecord } from './signed-record';
import { utc } from './signed-record';
import { FONT_WEIGHTS } from './fonts';
import { COLORS, s } from './styles';

function Tick({ on }: { on: boolean }) {
  return (
    <View
      style={{
        width: 11,
        height: 11,
        borderWidth: 0.9,
        borderColor: COLORS.ink,
        marginRight: 8,
        marginTop: 1,
        alignItems: 'center',
        justifyContent: 'center',
        backgroundColor: on ? COLORS.ink : undefined,
      }}
    >
      {on ? <Text style={{ color: '#ffffff', fontSize: 8, lineHeight: 1 }}>X</Text> : null}
    </View>
  );
}

function Filled({ label, width, children }: { label: string; width: number | string; children: React.ReactNode }) {
  return (
    <View style={{ width, paddingRight: 16 }}>
      <View
        style={{
          borderBottomWidth: 0.9,
          borderBottomColor: COLORS.text,
          minHeight: 30,
          justifyContent: 'flex-end',
          paddingBottom: 2,
        }}
      >
        {children}
      </View>
      <Text style={[s.small, { marginTop: 3 }]}>{label}</Text>
    </View>
  );
}

/**
 * The acceptance page of the signed copy: the same page as the unsigned proposal's, with the option the
 * buyer accepted marked, their signature (the drawn mark, or the typed name) on the buyer's line, the
 * date and time in UTC, their name, and the statement they signed. The company's lines stay blank.
 */
export function SignedAcceptance({
  snapshot,
  versionNumber,
  signed,
  notice,
}: {
  snapshot: ProposalSnapshot;
  versionNumber: number;
  signed: SignedRecord;
  notice: CoolingOffNotice;
}) {
  const company = line(snapshot.company.name);
  return (
    <View>
      <Text style={s.h1}>Acceptance</Text>
      <Text style={s.p}>
        {`This is the signed copy of proposal version ${versionNumber}. The buyer accepted the option marked below and signed electronically; the last page records how.`}
      </Text>
      <View style={{ marginTop: 10, marginBottom: 10 }}>
        {snapshot.options.map((o) => (
          <View key={o.position} style={{ flexDirection: 'row', marginBottom: 8 }} wrap={false}>
            <Tick on={o.position === signed.optionPosition} />
            <Text style={[{ flex: 1 }, o.position === signed.optionPosition ? s.strong : {}]}>
              {`Option ${o.position}: ${line(o.name)}`}
            </Text>
            <Text style={s.strong}>{money(o.price.totalCents)}</Text>
            <Text
              style={[s.small, { width: 150, textAlign: 'right' }]}
            >{`deposit ${money(o.price.depositCents)}`}</Text>
          </View>
        ))}
      </View>
      <View style={s.note}>
        <Text style={s.strong}>What the buyer signed</Text>
        <Text>{line(signed.statement)}</Text>
      </View>

      <Text style={s.h2}>Buyer</Text>
      <CancelStatement notice={notice} />
      <View style={{ flexDirection: 'row', marginBottom: 14 }} wrap={false}>
        <Filled label={signed.method === 'drawn' ? 'Signature (drawn)' : 'Signature (typed)'} width="60%">
          {signed.image ? (
            <Image
              src={{ data: signed.image, format: 'png' }}
              style={{ height: 54, objectFit: 'contain', objectPosition: 'left bottom' }}
            />
          ) : (
            <Text
              style={{
                fontSize: 18,
                lineHeight: 1.25,
                color: COLORS.ink,
                fontWeight: FONT_WEIGHTS.semibold,
                paddingTop: 10,
              }}
            >
              {line(signed.typedName ?? '')}
            </Text>
          )}
        </Filled>
        <Filled label="Date and time (UTC)" width="40%">
          <Text>{utc(signed.signedAt)}</Text>
        </Filled>
      </View>
      <View style={{ flexDirection: 'row', marginBottom: 14 }}>
        <Filled label="Name" width="60%">
          <Text>{line(signed.signerName)}</Text>
        </Filled>
        <Filled label="E-mail" width="40%">
          <Text>{line(signed.signerEmail)}</Text>
        </Filled>
      </View>

      <Text style={s.h2}>{`For ${company}`}</Text>
      <View style={{ flexDirection: 'row', marginBottom: 14 }}>
        <Filled label="Signature" width="60%">
          <Text> </Text>
        </Filled>
        <Filled label="Date" width="40%">
          <Text> </Text>
        </Filled>
      </View>
    </View>
  );
}
