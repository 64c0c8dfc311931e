import { defineConfig, devices } from '@playwright/test'
import { CHROMIUM_ARGS, CHROMIUM_EXECUTABLE } from './e2e/chromium'

const port = Number(process.env.E2E_PORT ?? 3100)
const databaseUrl = process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/tributary'

export default defineConfig({
  testDir: 'e2e',
  testMatch: '**/*.spec.ts',
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  reporter: 'list',
  timeout: 60_000,
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    screenshot: 'only-on-failure',
    trace: 'off',
  },
  webServer: {
    command: 'node --import tsx server/index.ts',
    url: `http://127.0.0.1:${port}/api/health`,
    env: { PORT: String(port), DATABASE_URL: databaseUrl, NODE_ENV: 'test', SIGN_IN_LIMIT: '1000' },
    reuseExistingServer: false,
    timeout: 30_000,
  },
  projects: [
    {
      name: 'debian-chromium',
      use: {
        ...devices['Desktop Chrome'],
        viewport: { width: 1440, height: 900 },
        launchOptions: {
          executablePath: CHROMIUM_EXECUTABLE,
          args: CHROMIUM_ARGS,
        },
      },
    },
  ],
})
