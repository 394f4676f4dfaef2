export * from './control-line';
export * from './encode-feed';
export * from './feed-header';
export type { FeedItem } from './feed-item';
export * from './feed-line-decoder';
export * from './feed-quality-counter';
export * from './parse-feed-line';
export * from './recorded-gaze-tsv';
