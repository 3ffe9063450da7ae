/**
 * Cross-field rules of the plan document (docs/plan-format.md) that a per-field schema cannot
 * state: unique ids, references, rod groups, reach links, supply ends. Kept apart from plan.ts so
 * each file stays small; plan.ts re-exports it.
 */
/** An issue with its path as zod keeps it (keys and indexes). */
export interface RawIssue {
  path: (string | number)[];
  message: string;
}

type LooseNode = { id?: unknown; kind?: unknown; standsOn?: unknown; count?: unknown; spacingM?: unknown; onTruck?: unknown; phases?: unknown };
type LooseLink = { id?: unknown; kind?: unknown; from?: unknown; to?: unknown };
const asList = (value: unknown): Record<string, unknown>[] =>
  Array.isArray(value) ? value.map((item) => (item && typeof item === 'object' ? (item as Record<string, unknown>) : {})) : [];

/**
 * Cross-field rules that a per-field schema cannot state: unique ids, references, rod groups,
 * reach links. Works on the raw input, so a document with a wrong type in one field still gets
 * its broken references reported in the same answer.
 */
export function findReferenceIssues(input: unknown): RawIssue[] {
  const issues: RawIssue[] = [];
  const doc = input && typeof input === 'object' ? (input as Record<string, unknown>) : {};
  const nodes = asList(doc.nodes) as LooseNode[];
  const links = asList(doc.links) as LooseLink[];
  const nodesReadable = Array.isArray(doc.nodes);
  const nodeById = new Map<string, LooseNode>();
  nodes.forEach((node, i) => {
    if (typeof node.id !== 'string') return;
    if (nodeById.has(node.id)) issues.push({ path: ['nodes', i, 'id'], message: `duplicate id "${node.id}"` });
    else nodeById.set(node.id, node);
  });
  nodes.forEach((node, i) => {
    if (node.kind === 'worker' && typeof node.standsOn === 'string') {
      const target = nodeById.get(node.standsOn);
      if (!target) issues.push({ path: ['nodes', i, 'standsOn'], message: `no node with id "${node.standsOn}"` });
      else if (target.kind === 'worker') issues.push({ path: ['nodes', i, 'standsOn'], message: 'a worker cannot stand on a worker' });
      else if (target.kind === 'supply-end') issues.push({ path: ['nodes', i, 'standsOn'], message: 'a supply end is a marker, not something to stand on' });
    }
    if (node.kind === 'bucket' && typeof node.onTruck === 'string' && nodeById.get(node.onTruck)?.kind !== 'truck') {
      issues.push({ path: ['nodes', i, 'onTruck'], message: `no truck with id "${node.onTruck}"` });
    }
    if (node.kind === 'supply-end' && Array.isArray(node.phases)) {
      node.phases.forEach((ref, k) => {
        if (typeof ref === 'string' && nodeById.get(ref)?.kind !== 'phase') issues.push({ path: ['nodes', i, 'phases', k], message: `no phase with id "${ref}"` });
      });
    }
    if (node.kind === 'ground-rod' && typeof node.count === 'number' && node.count > 1 && node.spacingM === undefined) {
      issues.push({ path: ['nodes', i, 'spacingM'], message: 'is required when count is more than 1' });
    }
  });
  const linkIds = new Set<string>();
  links.forEach((link, i) => {
    if (typeof link.id === 'string') {
      if (nodeById.has(link.id) || linkIds.has(link.id)) issues.push({ path: ['links', i, 'id'], message: `duplicate id "${link.id}"` });
      linkIds.add(link.id);
    }
    // With no readable node list, every reference would be "missing": report the list once instead.
    for (const end of nodesReadable ? (['from', 'to'] as const) : []) {
      const ref = link[end];
      if (typeof ref === 'string' && !nodeById.has(ref)) issues.push({ path: ['links', i, end], message: `no node with id "${ref}"` });
    }
    if (typeof link.from === 'string' && link.from === link.to) issues.push({ path: ['links', i, 'to'], message: 'must differ from "from"' });
    const fromKind = typeof link.from === 'string' ? nodeById.get(link.from)?.kind : undefined;
    const toKind = typeof link.to === 'string' ? nodeById.get(link.to)?.kind : undefined;
    if (link.kind === 'reach' && fromKind !== undefined && fromKind !== 'worker') {
      issues.push({ path: ['links', i, 'from'], message: 'a reach link starts at a worker' });
    }
    if ((link.kind === 'jumper' || link.kind === 'bond') && (fromKind === 'worker' || toKind === 'worker')) {
      issues.push({ path: ['links', i, 'kind'], message: 'a worker is joined to surfaces by reach links only; a worker is never a bonding path' });
    }
    if (fromKind === 'supply-end' || toKind === 'supply-end') {
      issues.push({ path: ['links', i, fromKind === 'supply-end' ? 'from' : 'to'], message: 'a supply end is a marker: it names its phases and takes no links' });
    }
  });
  return issues;
}

