/**
 * Lets at most `size` callers run at once and queues the rest in arrival order. Checkouts of one hot product queue
 * on its row lock anyway; queueing them here instead keeps them from holding every pooled connection while they wait,
 * so the rest of the app (and the pool's connect timeout) is not starved by a rush.
 */
export class Gate {
  private running = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(private readonly size: number) {}

  async run<T>(fn: () => Promise<T>): Promise<T> {
    if (this.running >= this.size) await new Promise<void>((resolve) => this.waiting.push(resolve));
    else this.running += 1;
    try {
      return await fn();
    } finally {
      const next = this.waiting.shift();
      if (next) next();
      else this.running -= 1;
    }
  }
}
