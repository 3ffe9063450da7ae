/**
 * One form in the inspector: fields in the chosen units, "Apply" validates with the plan schema
 * and stores nothing until every field is right; each error names its field.
 */
import { useEffect, useId, useState } from 'react';
import type { z } from 'zod';
import type { UnitSystem } from '@/lib/domain/units';
import { cableLabel } from '@/lib/domain/units';
import type { CableSize, PlanNode } from '@/lib/schemas/plan';
import { buildFromForm, toFormValues, type FieldSpec, type FormValues } from './fields';

export interface PropertiesFormProps {
  title: string;
  fields: FieldSpec[];
  source: Record<string, unknown>;
  schema: z.ZodTypeAny;
  units: UnitSystem;
  onApply: (value: Record<string, unknown>) => void;
  nodes?: readonly PlanNode[];
  readOnly?: boolean;
}

const unitHint = (f: FieldSpec, units: UnitSystem) => (f.type === 'length' ? (units === 'metric' ? 'm' : 'ft in') : units === 'imperial' && f.imperial ? f.imperial.unit : f.unit);

export function PropertiesForm({ title, fields, source, schema, units, onApply, nodes = [], readOnly = false }: PropertiesFormProps) {
  const formId = useId();
  const [values, setValues] = useState<FormValues>(() => toFormValues(fields, source, units));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [applied, setApplied] = useState(false);
  useEffect(() => {
    setValues(toFormValues(fields, source, units));
    setErrors({});
  }, [source, units, fields]);

  const change = (key: string, value: string) => {
    setValues((v) => ({ ...v, [key]: value }));
    setApplied(false);
  };
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const result = buildFromForm(fields, values, source, units, schema);
    if (!result.ok) {
      setErrors(result.errors);
      return;
    }
    setErrors({});
    setApplied(true);
    onApply(result.value);
  };
  const count = Object.keys(errors).length;

  return (
    <form onSubmit={submit} noValidate aria-label={title} className="space-y-3" data-testid="properties-form">
      <h3 className="text-base font-semibold">{title}</h3>
      {count > 0 && <p role="alert" className="text-sm font-semibold text-blocker">{count === 1 ? 'One field needs attention' : `${count} fields need attention`}; nothing was changed.</p>}
      {errors._form && <p className="text-sm text-blocker">{errors._form}</p>}
      {fields.map((f) => {
        const id = `${formId}-${f.key}`;
        const err = errors[f.key];
        const describedBy = err ? `${id}-err` : f.hint ? `${id}-hint` : undefined;
        const common = { id, name: f.key, disabled: readOnly, 'aria-invalid': err ? true : undefined, 'aria-describedby': describedBy };
        const unit = unitHint(f, units);
        return (
          <div key={f.key}>
            <label className="label text-sm" htmlFor={id}>
              {f.label}
              {unit ? <span className="font-normal text-note"> ({unit})</span> : null}
              {f.optional ? <span className="font-normal text-note"> · optional</span> : null}
            </label>
            {f.type === 'boolean' ? (
              <select className="field" {...common} value={values[f.key]} onChange={(e) => change(f.key, e.target.value)}>
                <option value="true">Yes</option>
                <option value="false">No</option>
              </select>
            ) : f.type === 'select' ? (
              <select className="field" {...common} value={values[f.key]} onChange={(e) => change(f.key, e.target.value)}>
                {f.options!.map((o) => (
                  <option key={o.value} value={o.value}>{f.key === 'cable' ? cableLabel(o.value as CableSize, units) : o.label}</option>
                ))}
              </select>
            ) : f.type === 'node' ? (
              <select className="field" {...common} value={values[f.key]} onChange={(e) => change(f.key, e.target.value)}>
                {!nodes.some((n) => n.id === values[f.key] && (!f.nodeFilter || f.nodeFilter(n.kind))) && <option value={values[f.key]}>{values[f.key] || '(choose)'}</option>}
                {nodes.filter((n) => !f.nodeFilter || f.nodeFilter(n.kind)).map((n) => (
                  <option key={n.id} value={n.id}>{n.id}{n.label ? ` · ${n.label}` : ''}</option>
                ))}
              </select>
            ) : (
              <input className="field num" {...common} inputMode={f.type === 'text' ? undefined : 'decimal'} value={values[f.key]} onChange={(e) => change(f.key, e.target.value)} />
            )}
            {err ? <p id={`${id}-err`} className="mt-1 text-sm text-blocker">{err}</p> : f.hint ? <p id={`${id}-hint`} className="mt-1 text-sm text-note">{f.hint}</p> : null}
          </div>
        );
      })}
      {!readOnly && (
        <div className="flex items-center gap-3">
          <button type="submit" className="btn-primary">Apply</button>
          {applied && count === 0 && <span className="text-sm text-clear" role="status">Applied</span>}
        </div>
      )}
    </form>
  );
}
