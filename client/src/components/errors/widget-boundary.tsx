import { Component, type ErrorInfo, type ReactNode } from 'react';
import { errorMessage } from '../../lib/api-error';
import { Button } from '../ui/button';

interface Props {
  /** What the widget is, for the message: "the user list". */
  name: string;
  children: ReactNode;
  onReset?: () => void;
}

interface State {
  error: unknown;
}

/** Keeps one broken panel from taking the page down with it. */
export class WidgetBoundary extends Component<Props, State> {
  override state: State = { error: null };

  static getDerivedStateFromError(error: unknown): State {
    return { error };
  }

  override componentDidCatch(error: unknown, info: ErrorInfo): void {
    console.error(`Widget "${this.props.name}" failed`, error, info.componentStack);
  }

  private readonly handleRetry = () => {
    this.props.onReset?.();
    this.setState({ error: null });
  };

  override render() {
    if (this.state.error === null) return this.props.children;
    return (
      <div role="alert" className="rounded-md border border-danger bg-danger-soft p-4">
        <p className="font-semibold text-danger">Could not show {this.props.name}.</p>
        <p className="mt-1 text-ink-950">{errorMessage(this.state.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={this.handleRetry}>
          Try again
        </Button>
      </div>
    );
  }
}
