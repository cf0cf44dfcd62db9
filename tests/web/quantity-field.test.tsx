import { describe, expect, it } from 'vitest'
import { useState } from 'react'
import { render, screen } from '@testing-library/react'
import userEvent from '@testing-library/user-event'
import { QuantityField, emptyQuantity, type QuantityValue } from '@/components/ui/quantity-field'
import { quantity, withUnit } from '@shared/schemas/quantities'

function Harness({ onValue }: { onValue: (v: QuantityValue) => void }) {
  const [v, setV] = useState(emptyQuantity('power'))
  return (
    <QuantityField
      label="Authorised EIRP"
      name="eirp"
      kind="power"
      value={v}
      onChange={(n) => {
        setV(n)
        onValue(n)
      }}
    />
  )
}

describe('the quantity field', () => {
  it('offers the units of its quantity and sends the figure with the chosen unit', async () => {
    let last: QuantityValue = emptyQuantity('power')
    render(<Harness onValue={(v) => (last = v)} />)
    const unit = screen.getByRole('combobox', { name: 'Unit of authorised eirp' })
    expect([...unit.querySelectorAll('option')].map((o) => o.textContent)).toEqual(['dBm', 'dBW', 'W', 'mW'])
    await userEvent.type(screen.getByLabelText('Authorised EIRP'), '2')
    await userEvent.selectOptions(unit, 'W')
    expect(withUnit(last.figure, last.unit)).toBe('2 W')
    // what the server reads from it: 10·log10(2000 mW) dBm (definition of dBm, common practice, no source)
    expect(quantity('power', { label: 'the EIRP' }).parse(withUnit(last.figure, last.unit))).toBeCloseTo(33.0103, 4)
  })

  it('shows a unit that cannot be changed as plain text, not a selector', () => {
    render(<QuantityField label="Antenna height" name="h" kind="height" value={emptyQuantity('height')} onChange={() => {}} />)
    expect(screen.queryByRole('combobox')).toBeNull()
    expect(screen.getByText('m')).toBeTruthy()
  })
})
