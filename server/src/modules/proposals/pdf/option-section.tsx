import { Text, View } from '@react-pdf/renderer';
import type { SnapshotOption } from '@contract';
import { btuh, line, money, plain } from './format';
import { Bullets, Pairs, Table } from './parts';
import { ScopeSection } from './scope-section';
import { s } from './styles';

type System = SnapshotOption['systems'][number];
type Model = System['outdoor'];

function capacity(m: Model): string {
  const parts = [
    m.nominalCoolingBtuh === null ? null : `Cooling ${btuh(m.nominalCoolingBtuh)}`,
    m.nominalHeatingBtuh === null ? null : `Heating ${btuh(m.nominalHeatingBtuh)}`,
  ].filter((x) => x !== null);
  return parts.length === 0 ? '—' : parts.join('\n');
}

function efficiency(m: Model): string {
  const parts = [
    m.seer2 === null ? null : `SEER2 ${plain(m.seer2)}`,
    m.eer2 === null ? null : `EER2 ${plain(m.eer2)}`,
    m.hspf2 === null ? null : `HSPF2 ${plain(m.hspf2)}`,
  ].filter((x) => x !== null);
  return parts.length === 0 ? '—' : parts.join('\n');
}

const modelCell = (m: Model) => `${line(m.name)}\nModel ${line(m.key)}`;

function equipmentRows(sys: System) {
  return [
    {
      key: `out:${sys.key}`,
      cells: ['Outdoor unit', modelCell(sys.outdoor), capacity(sys.outdoor), efficiency(sys.outdoor)],
    },
    ...sys.zones.map((z) => ({
      key: `in:${z.key}`,
      cells: [
        `Indoor unit, ${line(z.name)}${z.rooms.length > 0 ? `\nServes ${z.rooms.map(line).join(', ')}` : ''}`,
        modelCell(z.indoor),
        capacity(z.indoor),
        efficiency(z.indoor),
      ],
    })),
    ...(sys.heatKit
      ? [{ key: `kit:${sys.key}`, cells: ['Backup electric heat', modelCell(sys.heatKit), capacity(sys.heatKit), '—'] }]
      : []),
  ];
}

/** One option: its price, monthly estimates, equipment with model numbers and ratings, what is included, the work. */
export function OptionSection({ option }: { option: SnapshotOption }) {
  const p = option.price;
  return (
    <View>
      <Text style={s.h1}>{`Option ${option.position}: ${line(option.name)}`}</Text>

      <View style={{ flexDirection: 'row', marginTop: 4 }}>
        <View style={{ flex: 1, paddingRight: 18 }}>
          <Text style={[s.h2, { marginTop: 4 }]}>Price</Text>
          <Pairs
            pairs={[
              { label: 'Equipment, materials and labor', value: money(p.sellCents) },
              ...(p.discountCents > 0 ? [{ label: 'Discount', value: `−${money(p.discountCents)}` }] : []),
              ...(p.discountCents > 0 ? [{ label: 'Subtotal', value: money(p.subtotalCents) }] : []),
              { label: 'Sales tax', value: money(p.taxCents) },
              { label: 'Total price', value: money(p.totalCents), strong: true },
              { label: 'Deposit at signing', value: money(p.depositCents) },
              { label: 'Balance after the deposit', value: money(p.balanceCents) },
            ]}
          />
        </View>
        <View style={{ flex: 1 }}>
          <Text style={[s.h2, { marginTop: 4 }]}>Estimated monthly payments</Text>
          {option.monthly.length === 0 ? (
            <Text style={s.small}>No financing estimate is offered with this option.</Text>
          ) : (
            <View>
              <Table
                columns={[
                  { label: 'Plan', flex: 3 },
                  { label: 'Term', flex: 2, numeric: true },
                  { label: 'Per month', flex: 2, numeric: true },
                ]}
                rows={option.monthly.map((m, i) => ({
                  key: `${i}`,
                  cells: [
                    line(m.name),
                    `${m.months} months at ${plain(m.aprPercent)} % APR`,
                    money(m.monthlyPaymentCents),
                  ],
                }))}
              />
              <Text style={s.small}>
                Estimates of the payment on the balance after the deposit if it were financed on these terms. They are
                not an offer of credit: the lender sets the terms and decides whether to lend.
              </Text>
            </View>
          )}
        </View>
      </View>

      <Text style={s.h2}>Equipment</Text>
      {option.systems.map((sys) => (
        <View key={sys.key}>
          {option.systems.length > 1 ? <Text style={s.h3}>{line(sys.name)}</Text> : null}
          <Table
            columns={[
              { label: 'Unit', flex: 4 },
              { label: 'Make and model', flex: 4 },
              { label: 'Rated capacity', flex: 3 },
              { label: 'Efficiency', flex: 2.2 },
            ]}
            rows={equipmentRows(sys)}
          />
        </View>
      ))}
      <Text style={s.small}>
        Capacities are the maker’s nominal ratings. SEER2 and EER2 rate cooling efficiency, HSPF2 heating efficiency
        (higher is better), as tested under the US Department of Energy’s procedures.
      </Text>

      <Text style={s.h2}>What is included</Text>
      <Bullets items={option.included.map(line)} />

      <ScopeSection option={option} />
    </View>
  );
}
