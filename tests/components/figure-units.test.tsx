import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { FaultTable } from '@/components/editor/panels/FigureTables';
import type { CheckReport } from '@/lib/domain/report';

const report = {
  fault: { durationS: 0.25, decrementFactor: 1.05, asymmetricalKa: 10.5, peakFactor: 2.5, peakKa: 26, peakForceNPerM: 463 },
  tolerableBodyAmps: 0.2324,
} as unknown as CheckReport;

describe('the fault figures', () => {
  it('show the peak force in lbf/ft for a crew in feet (1 lbf = 4.4482216 N, 1 ft = 0.3048 m)', () => {
    render(<FaultTable report={report} units="imperial" />);
    expect(screen.getByText('31.7 lbf/ft')).toBeInTheDocument();
    expect(screen.getByText('232 mA')).toBeInTheDocument();
  });
  it('and in N/m in metres', () => {
    render(<FaultTable report={report} units="metric" />);
    expect(screen.getByText('463 N/m')).toBeInTheDocument();
  });
});
