import { Component, type ErrorInfo, type ReactNode } from 'react';

type AppErrorBoundaryProps = { children: ReactNode };
type AppErrorBoundaryState = { hasFailed: boolean };

// Rendered outside the router and the query client, so it uses nothing that depends on them.
function AppFailure() {
  return (
    <main
      id="main"
      className="mx-auto flex min-h-dvh max-w-xl flex-col justify-center gap-4 px-6 py-12"
    >
      <h1 className="text-2xl font-semibold">Wardbook stopped working</h1>
      <p className="text-ink-muted">
        Something went wrong while showing this page. Reloading usually clears it.
      </p>
      <div className="flex flex-wrap gap-3">
        <button
          type="button"
          onClick={() => window.location.reload()}
          className="inline-flex min-h-12 items-center rounded-md border border-brass-deep bg-brass px-5 font-semibold text-ink hover:bg-brass-light"
        >
          Reload the page
        </button>
        <a
          href="/"
          className="inline-flex min-h-12 items-center rounded-md border border-ink/35 bg-white px-5 font-semibold text-ink no-underline hover:bg-paper-deep"
        >
          Go to the start page
        </a>
      </div>
    </main>
  );
}

/** The last line of defence: catches anything the router's own error elements do not. */
export class AppErrorBoundary extends Component<AppErrorBoundaryProps, AppErrorBoundaryState> {
  state: AppErrorBoundaryState = { hasFailed: false };

  static getDerivedStateFromError(): AppErrorBoundaryState {
    return { hasFailed: true };
  }

  componentDidCatch(error: Error, info: ErrorInfo) {
    console.error('Wardbook could not render', error, info.componentStack);
  }

  render() {
    return this.state.hasFailed ? <AppFailure /> : this.props.children;
  }
}
