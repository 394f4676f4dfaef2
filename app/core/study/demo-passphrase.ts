/** The demo study's passphrase: it guards invented data only, and the lock screen shows it. */
export const DEMO_PASSPHRASE = 'gazeloom-demo';
