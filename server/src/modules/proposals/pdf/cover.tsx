import { Image, Text, View } from '@react-pdf/renderer';
import type { ProposalSnapshot } from '@contract';
import { day, line, money } from './format';
import { Table } from './parts';
import { COLORS, s } from './styles';
import type { Logo } from './logo';

/** One line of the site's address: "12 Fern Row, Unit 4, Alder Bay, OR 97000". */
export function siteLine(site: ProposalSnapshot['site']): string {
  const region = [site.region, site.postalCode].filter((x) => x.trim() !== '').join(' ');
  return line([site.street, site.unit, site.city, region].filter((x) => x.trim() !== '').join(', '));
}

/** The lowest monthly estimate of an option, or null when it offers none. */
function fromMonthly(option: ProposalSnapshot['options'][number]): number | null {
  const all = option.monthly.map((m) => m.monthlyPaymentCents);
  return all.length === 0 ? null : Math.min(...all);
}

/**
 * The first page: who the proposal is from (logo or name, contact lines), whom it is for and where, the
 * version and date, and the options at a glance with their totals.
 */
export function Cover({
  snapshot,
  versionNumber,
  logo,
}: {
  snapshot: ProposalSnapshot;
  versionNumber: number;
  logo: Logo | null;
}) {
  const c = snapshot.company;
  // The address as the owner wrote it, a line each (settings allow up to four), then phone and e-mail.
  const contact = [...(c.address ?? '').split('\n'), c.phone ?? '', c.email ?? ''].filter((x) => x.trim() !== '');
  return (
    <View>
      <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-start' }}>
        <View style={{ flex: 1, paddingRight: 16 }}>
          {logo ? (
            <Image src={logo} style={{ maxWidth: 190, maxHeight: 70, objectFit: 'contain', marginBottom: 8 }} />
          ) : null}
          <Text style={[s.h1, { fontSize: logo ? 13 : 18 }]}>{line(c.name)}</Text>
        </View>
        <View style={{ width: 200 }}>
          {contact.map((x, i) => (
            <Text key={i} style={[s.small, { textAlign: 'right' }]}>
              {line(x)}
            </Text>
          ))}
          {c.licence ? <Text style={[s.small, { textAlign: 'right' }]}>{line(c.licence)}</Text> : null}
        </View>
      </View>

      <View style={{ marginTop: 70, borderLeftWidth: 4, borderLeftColor: COLORS.ink, paddingLeft: 14 }}>
        <Text style={{ fontSize: 11, color: COLORS.inkSoft, fontWeight: 600, letterSpacing: 1 }}>
          HEATING AND COOLING PROPOSAL
        </Text>
        <Text style={{ fontSize: 26, fontWeight: 700, color: COLORS.ink, marginTop: 6, lineHeight: 1.15 }}>
          {line(snapshot.customer.name)}
        </Text>
        <Text style={{ fontSize: 12, marginTop: 4 }}>{siteLine(snapshot.site)}</Text>
        <Text style={[s.small, { marginTop: 10, fontSize: 10 }]}>
          {`Version ${versionNumber} · issued ${day(snapshot.issuedAt)}`}
        </Text>
      </View>

      <Text style={[s.h2, { marginTop: 60 }]}>Your options at a glance</Text>
      <Table
        columns={[
          { label: 'Option', flex: 3 },
          { label: 'Total price', flex: 2, numeric: true },
          { label: 'Deposit at signing', flex: 2, numeric: true },
          { label: 'Estimated monthly, from', flex: 2, numeric: true },
        ]}
        rows={snapshot.options.map((o) => {
          const monthly = fromMonthly(o);
          return {
            key: String(o.position),
            cells: [
              `${o.position}. ${line(o.name)}`,
              money(o.price.totalCents),
              money(o.price.depositCents),
              monthly === null ? '—' : `${money(monthly)} a month`,
            ],
          };
        })}
      />
      <Text style={[s.small, { marginTop: 6 }]}>
        Each option is described on its own pages: the equipment, what is included, the price and the installation work.
        Choose one option when you sign. Monthly figures are estimates, not an offer of credit.
      </Text>
    </View>
  );
}
