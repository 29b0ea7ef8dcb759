/**
 * Reactive controller that tracks an element's content width and asks the host to re-render when it changes.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';

/** Observes the host's width; disconnects its observer when the host leaves the page. */
export class WidthController implements ReactiveController {
  /** Current content width in CSS px (the fallback until the first measurement). */
  widthPx: number;
  private readonly host: ReactiveControllerHost & HTMLElement;
  private observer?: ResizeObserver;

  constructor(host: ReactiveControllerHost & HTMLElement, fallbackPx = 800) {
    this.host = host;
    this.widthPx = fallbackPx;
    host.addController(this);
  }

  hostConnected(): void {
    this.observer = new ResizeObserver((entries) => {
      const w = Math.floor(entries[0]?.contentRect.width ?? 0);
      // Ignore zero (hidden) and sub-pixel jitter so paths are not rebuilt for nothing.
      if (w > 0 && Math.abs(w - this.widthPx) >= 1) {
        this.widthPx = w;
        this.host.requestUpdate();
      }
    });
    this.observer.observe(this.host);
  }

  hostDisconnected(): void {
    this.observer?.disconnect();
    this.observer = undefined;
  }
}
