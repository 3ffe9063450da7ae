/** Practice names the elements of a drawing in words: a symbol without a label by its kind as the palette says it. */
import { describe, expect, it } from 'vitest';
import { elementName } from '@/components/practice/types';
import { planDocument } from '../helpers/factories';

describe('element names in practice', () => {
  it('names an unlabelled symbol by its kind in words, not by the kind code', () => {
    const doc = planDocument();
    expect(elementName(doc, 'CB')).toBe('Cluster bar CB');
    expect(elementName(doc, 'W1')).toBe('Worker W1');
    expect(elementName({ ...doc, nodes: doc.nodes.map((n) => (n.id === 'CB' ? { ...n, label: 'Bar at the feet' } : n)) }, 'CB')).toBe('Bar at the feet (CB)');
    expect(elementName(doc, 'jA')).toBe('jumper 2/0 A – CB (jA)');
  });
});
