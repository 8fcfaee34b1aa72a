import { formatNumber } from '@calc';
import type { TakeoffLineRecord } from '@contract';

const RULE_FROM: Record<NonNullable<TakeoffLineRecord['sellRule']>['source'], string> = {
  item: 'own rule',
  category: 'category',
  company: 'company default',
  option: "option's rule",
};

/** "margin 35 %" over "Equipment": the rule that sold a line and where it came from, in a few words. */
export function RuleWords({ rule }: { rule: NonNullable<TakeoffLineRecord['sellRule']> }) {
  const where = rule.source === 'category' && rule.from ? rule.from : RULE_FROM[rule.source];
  return (
    <span className="block text-muted">
      <span className="block whitespace-nowrap">
        {rule.method} {formatNumber(rule.percent, 2, { trim: true })}&nbsp;%
      </span>
      <span className="block">{where}</span>
    </span>
  );
}
