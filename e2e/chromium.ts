// Debian's Chromium as every browser test and benchmark launches it (never a downloaded browser).
// Background networking is off because this machine's closed network refuses those connections.
export const CHROMIUM_EXECUTABLE = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium'

export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
]
