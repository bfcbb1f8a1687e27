// @ts-check
// The live feed from /hubs/monitor (SignalR, loaded as the LibMan-restored browser bundle, global `signalR`).
//
// Gap-free and duplicate-free: the client subscribes first and learns the feed number at that moment (Watch and
// WatchAll return it); the page then loads its data over HTTP, which holds everything up to that number; entries
// pushed later carry their numbers. After a dropped connection the client subscribes again and asks CatchUp for the
// entries after the last number it saw, and any entry whose number it has already handled is dropped.

const words = {
  connecting: 'Connecting to the live feed…',
  live: 'Live: new points and alerts appear as they are measured.',
  'catching-up': 'Reconnected: fetching what was missed…',
  reconnecting: 'Connection lost: reconnecting. The page shows what it had; nothing is lost, missed entries follow on reconnection.',
  offline: 'Offline: the live feed is not connected. Retrying every 5 s; reload the page if this persists.',
};

export class LiveFeed {
  /**
   * @param {{ contexts?: string[], all?: boolean, onEntry: (entry) => void, banner?: HTMLElement }} options
   */
  constructor({ contexts = [], all = false, onEntry, banner }) {
    this.contexts = contexts;
    this.all = all;
    this.onEntry = onEntry;
    this.banner = banner;
    this.lastSeq = 0;
    this.buffer = null;
    this.connection = new signalR.HubConnectionBuilder()
      .withUrl('/hubs/monitor')
      .withAutomaticReconnect({ nextRetryDelayInMilliseconds: (ctx) => Math.min(5000, 500 * (ctx.previousRetryCount + 1)) })
      .configureLogging(signalR.LogLevel.Warning)
      .build();
    this.connection.on('Feed', (entries) => { for (const entry of entries) this.#receive(entry); });
    this.connection.onreconnecting(() => this.#show('reconnecting'));
    this.connection.onreconnected(() => this.#resume());
    this.connection.onclose(() => this.#retryLater());
  }

  /**
   * Subscribes, then runs `load` (the page's HTTP load) while buffering pushed entries, then delivers the buffered
   * entries the load did not already contain. Resolves once the page is current.
   */
  async start(load) {
    this.#show('connecting');
    this.buffer = [];
    try {
      await this.connection.start();
      this.lastSeq = await this.#subscribe();
    } catch {
      this.#show('offline');
      await load();
      this.buffer = null;
      this.#retryLater();
      return;
    }
    await load();
    const pending = this.buffer;
    this.buffer = null;
    for (const entry of pending) this.#deliver(entry);
    this.#show('live');
  }

  /** The feed number of the newest entry handled. */
  get seq() { return this.lastSeq; }

  async #subscribe() {
    return this.all
      ? await this.connection.invoke('WatchAll')
      : await this.connection.invoke('Watch', this.contexts);
  }

  #receive(entry) {
    if (this.buffer) this.buffer.push(entry);
    else this.#deliver(entry);
  }

  #deliver(entry) {
    if (entry.seq <= this.lastSeq) return; // already handled (the page load or an earlier catch-up had it)
    this.lastSeq = entry.seq;
    // The navigation's count, the desktop notifications and a wall screen's banner listen for alert changes.
    if (entry.kind === 'alert') document.dispatchEvent(new CustomEvent('finwatch:alert', { detail: entry.alert }));
    this.onEntry(entry);
  }

  async #resume() {
    this.#show('catching-up');
    try {
      this.buffer = [];
      await this.#subscribe();
      let missed;
      do {
        missed = await this.connection.invoke('CatchUp', this.lastSeq, this.all ? [] : this.contexts);
        for (const entry of missed) this.#deliver(entry);
      } while (missed.length >= 10000);
      const pending = this.buffer;
      this.buffer = null;
      pending.sort((a, b) => a.seq - b.seq);
      for (const entry of pending) this.#deliver(entry);
      this.#show('live');
    } catch {
      this.buffer = null;
      this.#show('reconnecting');
    }
  }

  #retryLater() {
    this.#show('offline');
    setTimeout(async () => {
      if (this.connection.state !== signalR.HubConnectionState.Disconnected) return;
      try {
        await this.connection.start();
        await this.#resume();
      } catch {
        this.#retryLater();
      }
    }, 5000);
  }

  #show(state) {
    this.state = state;
    if (!this.banner) return;
    this.banner.dataset.state = state;
    this.banner.textContent = words[state];
  }
}
