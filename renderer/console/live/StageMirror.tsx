import { useEffect, useRef } from 'react';
import type { LiveStatus } from '../../../app/contract';
import { placeSensor } from '../../../app/core/geometry/placement';
import { renderFrameAt } from '../../../app/core/render';
import { useHost } from '../host-context';

const MIRROR_WIDTH = 480;

/**
 * A small mirror of the stage: the clip as it is being shown (redrawn a few times a second
 * from the same events and renderer the stage uses) and the live gaze trail over it.
 */
export function StageMirror({ status }: { status: LiveStatus | null }) {
  const { api } = useHost();
  const canvas = useRef<HTMLCanvasElement>(null);
  const frame = useRef<{ image: ImageData; clip: string } | null>(null);
  const display = status?.display ?? null;
  const screen = display ? { widthPx: display.widthPx, heightPx: display.heightPx } : { widthPx: 1920, heightPx: 1080 };
  const scale = MIRROR_WIDTH / screen.widthPx;
  const playback = status?.playback ?? null;

  // The clip frame, at most four times a second.
  useEffect(() => {
    if (!playback || playback.stimulusUs === null) return;
    const tUs = playback.stimulusUs;
    const timer = setTimeout(async () => {
      const history = 170_000;
      const result = await api.readStimulusEvents({ id: playback.clip, fromUs: tUs - history, toUs: tUs + 1e-3, maxEvents: 400_000 });
      if (!result.ok) return;
      const image = new ImageData(playback.sensor.width, playback.sensor.height);
      renderFrameAt(result.value.events, playback.sensor, { look: 'polarity' }, tUs, image.data);
      frame.current = { image, clip: playback.clip };
    }, 250);
    return () => clearTimeout(timer);
  }, [api, playback?.clip, Math.floor((playback?.stimulusUs ?? 0) / 250_000)]);

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    c.width = MIRROR_WIDTH;
    c.height = Math.round(screen.heightPx * scale);
    ctx.fillStyle = 'rgb(128 128 128)';
    ctx.fillRect(0, 0, c.width, c.height);
    if (playback && frame.current?.clip === playback.clip) {
      const p = placeSensor(playback.sensor, screen, playback.placement);
      const off = document.createElement('canvas');
      off.width = playback.sensor.width;
      off.height = playback.sensor.height;
      off.getContext('2d')!.putImageData(frame.current.image, 0, 0);
      ctx.imageSmoothingEnabled = false;
      ctx.drawImage(off, p.left * scale, p.top * scale, playback.sensor.width * p.scale * scale, playback.sensor.height * p.scale * scale);
    }
    const trail = status?.trail ?? [];
    trail.forEach((point, i) => {
      if (!point) return;
      const alpha = (i + 1) / trail.length;
      ctx.fillStyle = `rgb(220 30 90 / ${alpha})`;
      ctx.beginPath();
      ctx.arc(point.x * scale, point.y * scale, i === trail.length - 1 ? 5 : 2.5, 0, 2 * Math.PI);
      ctx.fill();
    });
  });

  return <canvas ref={canvas} className="stage-mirror" data-testid="stage-mirror" role="img" aria-label="Mirror of the stage with the live gaze trail" />;
}
