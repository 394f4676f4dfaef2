import { describe, expect, it } from 'vitest';
import { batchFrom, type EventBatch } from '../../../../app/core/events/event-batch';
import { bytesSource, encodeGlev, GlevWriter, openGlev, type GlevWriterOptions } from '../../../../app/core/events/glev';

const sensor = { width: 640, height: 480 };
const us: GlevWriterOptions = { sensor, resolution: 'us' };
const ns: GlevWriterOptions = { sensor, resolution: 'ns' };

describe('GlevWriter refuses what it cannot store exactly', () => {
  it('names the event that goes back in time, counting across batches', () => {
    expect(() => encodeGlev(batchFrom([[10, 0, 0, 0], [12, 0, 0, 0], [11, 0, 0, 0]]), us)).toThrow(
      new RangeError('event 2: t = 11 µs is earlier than 12 µs of event 1; events must be in time order'),
    );
    const writer = new GlevWriter(us, () => undefined);
    writer.push(batchFrom([[5, 0, 0, 0], [7, 0, 0, 0]]));
    expect(() => writer.push(batchFrom([[7, 1, 1, 1], [6, 1, 1, 1]]))).toThrow(/^event 3: t = 6 µs is earlier than 7 µs of event 2/);
  });

  it.each([
    [us, 1.5, /^event 0: t = 1\.5 µs is not a whole number of microseconds \(write it with resolution 'ns', or round it\)/],
    [ns, 0.0005, /^event 0: t = 0\.0005 µs is not a whole number of nanoseconds/],
    [ns, 0.1 + 0.2, /^event 0: t = 0\.30000000000000004 µs is not a whole number of nanoseconds/],
    [us, -1, /^event 0: t = -1 µs is not a finite time >= 0/],
    [us, NaN, /^event 0: t = NaN µs is not a finite time >= 0/],
    [ns, Infinity, /^event 0: t = Infinity µs is not a finite time >= 0/],
    [us, 2 ** 53, /^event 0: t = 9007199254740992 µs is beyond 9007199254740991 µs, the latest time a us file holds exactly/],
    [ns, 2 ** 52 / 1000 + 0.001, /is beyond 4503599627370\.496 µs, the latest time a ns file holds exactly/],
  ] as const)('refuses the time %#', (options, tUs, message) => {
    expect(() => encodeGlev(batchFrom([[tUs, 0, 0, 0]]), options)).toThrow(message);
  });

  it('refuses events off the sensor and polarities other than 0 and 1, naming the event', () => {
    const at = (x: number, y: number, p: number) => () => encodeGlev(batchFrom([[0, 0, 0, 0], [1, x, y, p]]), us);
    expect(at(640, 0, 0)).toThrow(new RangeError('event 1: x = 640 is outside the sensor width 640 (0..639; at most 65535)'));
    expect(at(0, 480, 0)).toThrow(new RangeError('event 1: y = 480 is outside the sensor height 480 (0..479; at most 32767)'));
    expect(at(0, 0, 2)).toThrow(new RangeError('event 1: polarity 2 is neither 0 (OFF) nor 1 (ON)'));
  });

  it.each([
    [{ sensor: { width: 0, height: 480 }, resolution: 'us' }, /^sensor\.width must be an integer in 1\.\.65536 \(x is stored in 16 bits\), got 0/],
    [{ sensor: { width: 65537, height: 480 }, resolution: 'us' }, /^sensor\.width must be an integer in 1\.\.65536/],
    [{ sensor: { width: 640.5, height: 480 }, resolution: 'us' }, /^sensor\.width must be an integer/],
    [{ sensor: { width: 640, height: 32769 }, resolution: 'us' }, /^sensor\.height must be an integer in 1\.\.32768 \(y is stored in 15 bits beside the polarity\), got 32769/],
    [{ sensor, resolution: 'ms' }, /^resolution must be 'us' or 'ns', got ms/],
    [{ sensor, resolution: 'us', chunkEvents: 0 }, /^chunkEvents must be an integer in 1\.\.65536, got 0/],
    [{ sensor, resolution: 'us', chunkEvents: 65537 }, /^chunkEvents must be an integer in 1\.\.65536, got 65537/],
  ] as const)('refuses the options %#', (options, message) => {
    expect(() => new GlevWriter(options as unknown as GlevWriterOptions, () => undefined)).toThrow(message);
  });

  it('refuses columns of unequal length, and use after finish()', () => {
    const writer = new GlevWriter(us, () => undefined);
    const ragged = { ...batchFrom([[0, 0, 0, 0], [1, 0, 0, 0]]), p: new Uint8Array(1) } as EventBatch;
    expect(() => writer.push(ragged)).toThrow(/^batch columns must have equal lengths, got t 2, x 2, y 2, p 1/);
    writer.finish();
    expect(() => writer.push(batchFrom([[0, 0, 0, 0]]))).toThrow(/push after finish/);
    expect(() => writer.finish()).toThrow(/finish\(\) called twice/);
  });

  it('gives the sink a blank placeholder first and counts every byte', () => {
    const sizes: number[] = [];
    const writer = new GlevWriter({ ...us, chunkEvents: 2 }, (b) => sizes.push(b.length));
    expect(sizes).toEqual([48]);
    writer.push(batchFrom([[0, 0, 0, 0], [1, 0, 0, 0], [2, 0, 0, 0]]));
    expect(writer.finish().length).toBe(48);
    expect(sizes).toEqual([48, 32, 24, 2 * 28 + 4]);
    expect([writer.eventCount, writer.chunkCount, writer.bytesWritten]).toEqual([3, 2, 48 + 32 + 24 + 60]);
  });
});

describe('GlevReader refuses invalid parameters', () => {
  it('names the parameter', async () => {
    const reader = await openGlev(bytesSource(encodeGlev(batchFrom([[0, 0, 0, 0]]), us)), 'one.glev');
    await expect(reader.readChunk(1)).rejects.toThrow(new RangeError('chunk must be an integer in 0..0, got 1'));
    await expect(reader.readChunk(-1)).rejects.toThrow(RangeError);
    await expect(reader.readChunk(0.5)).rejects.toThrow(RangeError);
    await expect(reader.seek(NaN)).rejects.toThrow(new RangeError('tUs must be a time in µs, got NaN'));
    await expect(reader.readRange(NaN, 1)).rejects.toThrow(/^fromUs must be a time/);
    await expect(reader.readRange(0, NaN)).rejects.toThrow(/^toUs must be a time/);
  });
});
