import { Component, type ErrorInfo, type ReactNode } from 'react';
import { Button } from '../components/ui/button';

interface State {
  error: Error | null;
}

/** The last line of defence: catches what escapes the router's own error pages (a failure in the
 * providers or the router itself) and offers a reload instead of a blank page. */
export class TopLevelBoundary extends Component<{ children: ReactNode }, State> {
  state: State = { error: null };

  static getDerivedStateFromError(error: Error): State {
    return { error };
  }

  componentDidCatch(error: Error, info: ErrorInfo) {
    console.error('Compline stopped on an error:', error, info.componentStack);
  }

  render() {
    if (!this.state.error) return this.props.children;
    return (
      <main className="mx-auto flex min-h-dvh max-w-lg flex-col justify-center gap-4 px-6">
        <p className="figures text-sm text-ink-faint">Compline</p>
        <h1 className="text-2xl font-semibold">Compline stopped on an error</h1>
        <p className="text-ink-soft">
          Nothing you saved is lost: every change is kept on the server as soon as it is accepted. Reload the page to carry on.
        </p>
        <div>
          <Button variant="primary" onClick={() => window.location.reload()}>
            Reload Compline
          </Button>
        </div>
      </main>
    );
  }
}
