/**
 * The right-hand inspector: the selected element's form, or with nothing selected the plan's
 * system data and criteria; the units switch (metric / imperial) sits at its top.
 */
import { useCallback } from 'react';
import type { PlanCriteria, PlanLink, PlanNode, PlanSystem } from '@/lib/schemas/plan';
import { KIND_LABELS, LINK_LABELS } from '@/components/editor/plan-ops';
import { findElement, isLink, useEditor } from '@/components/editor/selectors';
import { CRITERIA_FIELDS, CRITERIA_SCHEMA, LINK_FIELDS, LINK_SCHEMA, NODE_FIELDS, NODE_SCHEMA, SYSTEM_FIELDS, SYSTEM_SCHEMA } from './fields';
import { PropertiesForm } from './PropertiesForm';
import { SetPicker } from './SetPicker';

const EMPTY: PlanNode[] = [];
const DEFAULT_CRITERIA = { bodyKg: 50 };

function UnitsSwitch() {
  const units = useEditor((s) => s.units);
  const setUnits = useEditor((s) => s.setUnits);
  return (
    <div role="radiogroup" aria-label="Units" className="flex rounded-md border border-line">
      {(['imperial', 'metric'] as const).map((u) => (
        <button key={u} type="button" role="radio" aria-checked={units === u} onClick={() => setUnits(u)}
          className={`min-h-touch flex-1 px-3 text-sm font-semibold ${units === u ? 'bg-ink text-white' : 'bg-white'}`}>
          {u === 'imperial' ? 'Feet, AWG' : 'Metres'}
        </button>
      ))}
    </div>
  );
}

export function Inspector() {
  const selection = useEditor((s) => s.selection);
  const element = useEditor((s) => (s.selection.length === 1 ? findElement(s.doc, s.selection[0]) : undefined));
  const system = useEditor((s) => s.doc.system);
  const criteria = useEditor((s) => s.doc.criteria);
  // The node list only matters to a worker's "Stands on"; other forms do not follow every drag.
  const nodes = useEditor((s) => (element?.kind === 'worker' ? s.doc.nodes : EMPTY));
  const units = useEditor((s) => s.units);
  const readOnly = useEditor((s) => s.readOnly);
  const explanation = useEditor((s) => (element ? s.explanations[element.id] : undefined));
  const updateElement = useEditor((s) => s.updateElement);
  const updateSystem = useEditor((s) => s.updateSystem);
  const updateCriteria = useEditor((s) => s.updateCriteria);
  const deleteSelection = useEditor((s) => s.deleteSelection);
  const duplicate = useEditor((s) => s.duplicateSelection);
  const applyElement = useCallback((v: Record<string, unknown>) => updateElement(v as PlanNode | PlanLink), [updateElement]);

  let body: React.ReactNode;
  if (selection.length > 1) {
    body = (
      <div className="space-y-3">
        <p className="font-semibold">{selection.length} elements selected</p>
        {!readOnly && (
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn" onClick={duplicate}>Duplicate</button>
            <button type="button" className="btn" onClick={deleteSelection}>Delete</button>
          </div>
        )}
      </div>
    );
  } else if (element) {
    const link = isLink(element);
    const title = `${link ? LINK_LABELS[element.kind as PlanLink['kind']] : KIND_LABELS[(element as PlanNode).kind]} ${element.id}`;
    body = (
      <>
        {link && <p className="mb-2 text-sm text-note">From {(element as PlanLink).from} to {(element as PlanLink).to}</p>}
        {explanation && (
          <section aria-label="Explain" className="mb-4 rounded-md border border-accent bg-paper p-3" data-testid="explain">
            <h3 className="mb-1 font-semibold">What {element.id} does in the zone</h3>
            <ul className="list-disc space-y-1 pl-5 text-sm">{explanation.map((line) => <li key={line}>{line}</li>)}</ul>
          </section>
        )}
        {!readOnly && element.kind === 'jumper' && <SetPicker jumper={element as Extract<PlanLink, { kind: 'jumper' }>} />}
        <PropertiesForm
          key={element.id}
          title={title}
          fields={link ? LINK_FIELDS[(element as PlanLink).kind] : NODE_FIELDS[(element as PlanNode).kind]}
          source={element as unknown as Record<string, unknown>}
          schema={link ? LINK_SCHEMA : NODE_SCHEMA}
          units={units}
          nodes={nodes}
          readOnly={readOnly}
          onApply={applyElement}
        />
        {!readOnly && <button type="button" className="btn mt-4 w-full" onClick={deleteSelection}>Delete {element.id}</button>}
      </>
    );
  } else {
    body = (
      <div className="space-y-6">
        <PropertiesForm title="System data" fields={SYSTEM_FIELDS} source={system as Record<string, unknown>} schema={SYSTEM_SCHEMA} units={units} readOnly={readOnly} onApply={(v) => updateSystem(v as PlanSystem)} />
        <PropertiesForm title="Criteria" fields={CRITERIA_FIELDS} source={(criteria ?? DEFAULT_CRITERIA) as Record<string, unknown>} schema={CRITERIA_SCHEMA} units={units} readOnly={readOnly} onApply={(v) => updateCriteria(v as PlanCriteria)} />
      </div>
    );
  }
  return (
    <aside aria-label="Inspector" className="flex h-full flex-col gap-4 overflow-y-auto border-l border-line bg-white p-4" data-testid="inspector">
      <UnitsSwitch />
      {body}
    </aside>
  );
}
