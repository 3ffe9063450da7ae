/** The PDF writes superscript powers its embedded fonts lack as powers, never as "?". */
import { describe, expect, it } from 'vitest';
import { pdfText } from '@/components/editor/export';

describe('powers in the PDF', () => {
  it('writes 10⁻⁷ as 10^-7 and keeps the Latin-1 squares and cubes', () => {
    expect(pdfText('force 2×10⁻⁷·i_p²/d')).toBe('force 2×10^-7·i_p²/d');
    expect(pdfText('x¹⁰ and 4 m² and 1 m³')).toBe('x^10 and 4 m² and 1 m³');
    expect(pdfText('10⁻⁷')).not.toContain('?');
  });
});
