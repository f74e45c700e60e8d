import { Component, Suspense, type ReactNode } from 'react';
import { Button } from './button';
import { Spinner } from './spinner';

interface State { failed: boolean; attempt: number }

/**
 * A part of a page whose code is loaded separately (a lazy panel): a small spinner while its code loads,
 * and if the code cannot be fetched (the connection dropped before it arrived) a short note in its place
 * with a retry (also tried by itself when the browser is back online; Chromium keeps a failed module
 * fetch for the page's life, so there a reload is what brings the panel back). The rest of the page (the canvas,
 * editing while offline) is never taken down by a panel that did not load.
 */
export class ChunkBoundary extends Component<{ children: ReactNode; what?: string }, State> {
  override state: State = { failed: false, attempt: 0 };

  static getDerivedStateFromError(): Partial<State> {
    return { failed: true };
  }

  override componentDidMount() { window.addEventListener('online', this.retry); }
  override componentWillUnmount() { window.removeEventListener('online', this.retry); }

  retry = () => { if (this.state.failed) this.setState((s) => ({ failed: false, attempt: s.attempt + 1 })); };

  override render() {
    if (this.state.failed) {
      return (
        <div role="status" className="m-2 flex flex-col items-start gap-2 rounded border border-rose-900/70 bg-rose-950/30 p-3 text-xs text-slate-300">
          <span>
            The {this.props.what ?? 'panel'} could not be loaded: the connection was lost before its code arrived.
            The board keeps working. Once you are back online (the status above the canvas reads live, so your
            edits are shared), try again or reload the page.
          </span>
          <span className="flex gap-2">
            <Button size="sm" onClick={this.retry}>Try again</Button>
            <Button size="sm" onClick={() => window.location.reload()}>Reload page</Button>
          </span>
        </div>
      );
    }
    return (
      <Suspense key={this.state.attempt} fallback={<div className="flex justify-center p-3 text-amber-glow"><Spinner size="sm" label="Loading panel" /></div>}>
        {this.props.children}
      </Suspense>
    );
  }
}
