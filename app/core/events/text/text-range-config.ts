import type { TextLayout } from './text-layout';
import type { TextRangeConfig } from './text-range-types';
import { TIME_UNITS } from './text-time-unit';

/** What the hot loop needs to know about a file, from its layout. */
export function textRangeConfig(layout: TextLayout, allowUnsorted: boolean): TextRangeConfig {
  const rule = TIME_UNITS[layout.unit];
  return {
    comma: layout.format === 'csv',
    roles: layout.roles,
    decimals: rule.decimals,
    tickLimit: rule.tickLimit,
    ticksPerUs: rule.ticksPerUs,
    width: layout.sensor?.width ?? 65536,
    height: layout.sensor?.height ?? 65536,
    checkOrder: !allowUnsorted,
  };
}
