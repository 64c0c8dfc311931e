/**
 * Readable citations. The catalogues mark each value with a status tag and a reference number
 * from the team's reference notes (e.g. "C [S13]"); reviewers need words, not our shorthand.
 * `describeSource` turns a catalogue source string into a sentence a reviewer can check.
 */

/** The publications our table values were read from, by reference number. */
export const SOURCE_TITLES: Record<string, string> = {
  S3: 'IPC Section 604.3 and Table 604.3 (UpCodes copy)',
  S5: 'Engineering ToolBox, "Converting WSFU to GPM"',
  S6: 'Illinois Plumbing Code, 77 Ill. Adm. Code 890, Appendix A Table N',
  S7: 'Model code Appendix B, Table B.5.4 (UpCodes copy)',
  S8: 'Class notes on IPC water sizing',
  S9: 'IPC Appendix E, Sections E101–E103 (adopted copies)',
  S10: 'North Carolina 2006 Plumbing Code, Appendix E',
  S13: 'UPC 2018 Appendix A as adopted by Washington (Table A 103.1)',
  S15: '2018 IPC, Table E103.3(2)',
  S18: 'Los Angeles plan-check water sizing worksheet (UPC tables)',
  S26: 'Copper Development Association, Copper Tube Handbook Table 14.2f',
  S28: 'Copper tube size chart (Types K, L, M)',
  S29: 'sizes.com, copper tube dimensions',
  S33: 'PEX dimensional data (ASTM F876 SDR 9), county records copy',
  S34: 'CPVC technical information reproducing ASTM D2846 Table I',
  S36: 'Grinnell Mechanical Installation Handbook, steel pipe dimensions',
  S37: 'ASME B36.10M chart reproduction',
  S38: 'ASME B36.10M chart (Schedule 40)',
  S39: 'Piping Designer, equivalent length of fittings (Schedule 40)',
  S41: 'Hazen–Williams formula, SI and US forms (fire-protection reference)',
  S42: 'Piping Designer, Hazen–Williams head loss',
  S48: 'Engineering ToolBox, Hazen–Williams coefficients',
  S49: 'LMNO Engineering, C and roughness tables',
  S51: 'Darcy–Weisbach and Colebrook summary',
  S54: 'Swamee & Jain (1976), J. Hydraulics Div. ASCE, via Engineers Edge',
  S55: 'Swamee–Jain validity range and worked example',
  S57: 'eFunda, absolute pipe roughness (Binder 1973)',
  S59: 'Pipe roughness table (process engineering reference)',
  S60: 'Absolute roughness table',
  S61: 'Engineers Edge, water density and viscosity',
  S62: 'International Critical Tables, viscosity and density of water',
}

const STATUS: Record<string, string> = {
  C: 'confirmed in',
  'C*': 'confirmed in a secondary copy:',
  X: 'computed by us from',
}

/**
 * A reviewer-readable version of a catalogue source string.
 * @example describeSource('UPC 2018 Table A 103.1, C [S13]')
 * // 'UPC 2018 Table A 103.1, confirmed in UPC 2018 Appendix A as adopted by Washington (Table A 103.1)'
 */
export function describeSource(text: string): string {
  return text
    .replace(/\b(C\*|C|X)\s*\[(S\d+)\]/g, (_m, status: string, id: string) => {
      const title = SOURCE_TITLES[id]
      return title ? `${STATUS[status]} ${title}` : `${STATUS[status]} reference ${id}`
    })
    .replace(/\[(S\d+)\]/g, (_m, id: string) => SOURCE_TITLES[id] ?? `reference ${id}`)
    .replace(/\(M\)|\bM\b(?=\s*$|[;,)])/g, (_m, offset: number, whole: string) =>
      /from memory\W*$/.test(whole.slice(0, offset))
        ? '(not yet checked against the printed code)'
        : '(from memory, not yet checked against the printed code)',
    )
    .replace(/\(=IL\)/g, '(same value in the Illinois Plumbing Code)')
}
