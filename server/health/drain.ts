/**
 * Whether this app server is shutting down. From the first SIGTERM/SIGINT readiness answers 503, so a
 * load balancer sends the next requests to another server, and no new live board stream is opened here.
 */
export class Drain {
  draining = false

  begin(): void {
    this.draining = true
  }
}
