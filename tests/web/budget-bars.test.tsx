/** BudgetBars: an uncertainty budget as bars a screen reader can read (plain HTML, no canvas). */
import { render, screen, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { BudgetBars } from '@/components/charts'

describe('BudgetBars', () => {
  it('lists each contribution, largest share first, as a meter with its percentage and its dB', () => {
    render(
      <BudgetBars
        title="Uncertainty of the EIRP"
        rows={[
          { name: 'Cable loss', contributionDb: 0.3, varianceShare: 0.03 },
          { name: 'Antenna factor', contributionDb: 1.2, varianceShare: 0.45 },
          { name: 'Site (multipath)', contributionDb: 1.3, varianceShare: 0.52 },
        ]}
        combinedStandardUncertaintyDb={1.79}
        expandedUncertaintyDb={3.58}
        coverageFactor={2}
      />,
    )
    const figure = screen.getByRole('figure', { name: 'Uncertainty of the EIRP' })
    const meters = within(figure).getAllByRole('meter')
    expect(meters.map((m) => m.getAttribute('aria-label'))).toEqual(['Site (multipath): share of the variance', 'Antenna factor: share of the variance', 'Cable loss: share of the variance'])
    expect(meters.map((m) => m.getAttribute('aria-valuetext'))).toEqual(['52.0 %', '45.0 %', '3.0 %'])
    expect(within(figure).getByText('52.0 % · 1.30 dB')).toBeInTheDocument()
    expect(figure).toHaveTextContent('uc = 1.79 dB · U = 3.58 dB (k = 2)')
  })
})
