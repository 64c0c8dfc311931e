import { describe, expect, it } from 'vitest'
import { FIXTURES } from '../../../shared/calc/fixtures.ts'
import { describeSource } from '../../../shared/calc/sources.ts'

describe('readable citations', () => {
  it.each([
    [
      'UPC 2018 Table A 103.1, C [S13]',
      'UPC 2018 Table A 103.1, confirmed in UPC 2018 Appendix A as adopted by Washington (Table A 103.1)',
    ],
    [
      'carried by the flush valve series, C* [S18]',
      'carried by the flush valve series, confirmed in a secondary copy: Los Angeles plan-check water sizing worksheet (UPC tables)',
    ],
    [
      'IPC Table E103.3(2), from memory (M)',
      'IPC Table E103.3(2), from memory (not yet checked against the printed code)',
    ],
    [
      'cold/hot = 3/4 of total (M)',
      'cold/hot = 3/4 of total (from memory, not yet checked against the printed code)',
    ],
  ])('%s', (raw, readable) => {
    expect(describeSource(raw)).toBe(readable)
  })

  it('leaves no shorthand reference number in any catalogue source', () => {
    for (const f of Object.values(FIXTURES)) {
      for (const text of [f.ipc.source, f.upc.source, f.minPressureSource, f.minNominalSource]) {
        expect(describeSource(text), text).not.toMatch(/\[S\d+\]/)
      }
    }
  })
})
