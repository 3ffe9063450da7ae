/**
 * A finding's rule id as a small muted label beside the finding, for looking the rule up
 * (docs/rules.md); the sentence a crew reads never carries it. Rendered static in .astro pages too.
 */
export function RuleId({ rule }: { rule: string }) {
  return <code className="rounded bg-paper px-1 text-xs font-normal text-note" data-rule-id={rule} title="Rule id">{rule}</code>;
}
