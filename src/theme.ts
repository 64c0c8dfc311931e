import type { GlobalThemeOverrides } from 'naive-ui'

/** Tributary's palette: a deep river blue for actions, warm clay for hot water. */
export const palette = {
  ink: '#1d2833',
  river: '#17405e',
  riverLight: '#2a6a94',
  cold: '#1f6fb2',
  hot: '#c2482b',
  paper: '#f6f7f5',
  line: '#d9dde0',
} as const

const font = '"IBM Plex Sans", system-ui, sans-serif'

export const themeOverrides: GlobalThemeOverrides = {
  common: {
    fontFamily: font,
    fontFamilyMono: '"IBM Plex Mono", ui-monospace, monospace',
    primaryColor: palette.river,
    primaryColorHover: palette.riverLight,
    primaryColorPressed: '#10314a',
    primaryColorSuppl: palette.riverLight,
    bodyColor: palette.paper,
    textColorBase: palette.ink,
    borderRadius: '4px',
  },
  Layout: { headerColor: '#ffffff', color: palette.paper },
  // The editor's side panel has four tabs, one with a problem count, in 372 px.
  Tabs: { tabGapSmallLine: '22px' },
}
