export * from './create-feed-listener';
export * from './feed-listener';
export * from './feed-sender';
export * from './feed-url';
export * from './deadline-timer';
export * from './feed-check';
export * from './replay-gaze';
