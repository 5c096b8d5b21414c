/** the services `npm test` started; a test run outside it fails with a clear message */
export function testEnv(name: 'DATABASE_URL' | 'SMTP_URL' | 'WALLPULSE_BASE_URL' | 'WALLPULSE_TEST_DATA_DIR'): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the tests with \`npm test\`, which starts the database, mail and app they need`);
  return value;
}
