/**
 * A worker that drains a queue kept in MariaDB: `kick()` asks for a pass soon (coalescing calls made during one),
 * a timer polls in case work arrived elsewhere (another instance, a crash before a kick), `settled()` waits for the
 * pass in progress, `stop()` ends it for shutdown. Subclasses implement `drain()`.
 */
export abstract class BackgroundLoop {
  private running = false;
  private again = false;
  protected stopped = false;
  private idle: Promise<void> = Promise.resolve();
  private timer: NodeJS.Timeout | null = null;

  constructor(private readonly pollMs: number) {}

  protected abstract drain(): Promise<void>;

  start() {
    this.kick();
    this.timer = setInterval(() => this.kick(), this.pollMs);
    this.timer.unref();
  }

  kick() {
    if (this.stopped) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = true;
    this.idle = this.drain().finally(() => {
      this.running = false;
      if (this.again && !this.stopped) {
        this.again = false;
        this.kick();
      }
    });
  }

  /** Resolves when no pass is in progress: tests and shutdown wait on it. */
  async settled() {
    do await this.idle;
    while (this.running);
  }

  async stop() {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    await this.idle;
  }
}
