// Runs the tool states: feeds them pointer samples, fires a long press when a press stays still, and cancels the
// gesture when a second finger arrives (the view then pinches and pans instead).
import { idle } from './idle';
import { LONG_PRESS_MS, moved, type PointerSample, type ToolContext, type ToolState } from './tool-state';

export class ToolMachine {
  private state: ToolState = idle;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private pressedAt: PointerSample | null = null;

  constructor(private readonly context: () => ToolContext) {}

  get stateName(): string {
    return this.state.name;
  }

  down(p: PointerSample): void {
    if (this.state !== idle) this.cancel();
    this.state = this.state.down?.(this.context(), p) ?? this.state;
    this.pressedAt = p;
    this.clearTimer();
    this.timer = setTimeout(() => {
      this.timer = null;
      if (this.state.longPress) this.state = this.state.longPress(this.context());
    }, LONG_PRESS_MS);
  }

  move(p: PointerSample): void {
    if (this.pressedAt && moved(this.pressedAt, p)) this.clearTimer();
    if (this.state.move) this.state = this.state.move(this.context(), p);
  }

  up(p: PointerSample): void {
    this.clearTimer();
    this.pressedAt = null;
    if (this.state.up) this.state = this.state.up(this.context(), p);
    this.state = idle;
  }

  cancel(): void {
    this.clearTimer();
    this.pressedAt = null;
    if (this.state.cancel) this.state = this.state.cancel(this.context());
    this.state = idle;
  }

  private clearTimer() {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }
}
