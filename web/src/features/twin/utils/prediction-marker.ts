import type uPlot from 'uplot';

const TWIN = '#6d28d9';

/**
 * Marks where the model's forecast begins: a dashed line, a faint tint over what lies ahead and the
 * words "model prediction", so a forecast is never read as a measurement.
 */
export function predictionMarker(start: () => number | null): uPlot.Plugin {
  return {
    hooks: {
      draw: [
        (u) => {
          const at = start();
          if (at === null) return;
          const { left, top, width, height } = u.bbox;
          const x = Math.round(u.valToPos(at, 'x', true));
          if (x < left || x > left + width) return;
          const ratio = window.devicePixelRatio || 1;
          const ctx = u.ctx;
          ctx.save();
          ctx.fillStyle = 'rgba(109, 40, 217, 0.05)';
          ctx.fillRect(x, top, left + width - x, height);
          ctx.strokeStyle = TWIN;
          ctx.lineWidth = ratio;
          ctx.setLineDash([3 * ratio, 3 * ratio]);
          ctx.beginPath();
          ctx.moveTo(x, top);
          ctx.lineTo(x, top + height);
          ctx.stroke();
          ctx.fillStyle = TWIN;
          ctx.font = `500 ${12 * ratio}px "Roboto Condensed", sans-serif`;
          ctx.textBaseline = 'top';
          ctx.fillText('model prediction →', x + 4 * ratio, top + 4 * ratio);
          ctx.restore();
        },
      ],
    },
  };
}
