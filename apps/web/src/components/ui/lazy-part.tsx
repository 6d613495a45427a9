import { Component, type ComponentType, type ReactNode, lazy } from 'react';

/** A part's script could not be fetched (offline, or a deploy replaced the files): the page itself is fine. */
export class PartLoadError extends Error {}

/** React.lazy over a named export, with a failed fetch reported as a PartLoadError. */
export function lazyPart<P extends object>(load: () => Promise<ComponentType<P>>) {
  return lazy(() =>
    load().then(
      (component) => ({ default: component }),
      (cause: unknown) => {
        throw new PartLoadError(cause instanceof Error ? cause.message : String(cause));
      },
    ),
  );
}

/** Shows `failed` when a lazy part's script could not be fetched; any other error still reaches the page's error screen. */
export class PartLoadBoundary extends Component<{ failed: ReactNode; children: ReactNode }, { error: unknown }> {
  state = { error: null as unknown };

  static getDerivedStateFromError(error: unknown) {
    return { error };
  }

  render() {
    const { error } = this.state;
    if (error === null) return this.props.children;
    if (!(error instanceof PartLoadError)) throw error;
    return this.props.failed;
  }
}
