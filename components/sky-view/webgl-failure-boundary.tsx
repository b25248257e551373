'use client';

import { Component, type ReactNode } from 'react';

/**
 * Turns an error thrown while the WebGL canvas starts or draws into the view's
 * fallback to the CPU renderer, instead of the page's error screen. A context
 * lost while r3f is still setting up makes three.js throw as it creates its
 * renderer (shader precision reads come back null), before any
 * 'webglcontextlost' listener exists.
 */
export class WebGlFailureBoundary extends Component<{ onFailure: (reason: string) => void; children: ReactNode }, { failed: boolean }> {
  state = { failed: false };

  static getDerivedStateFromError(): { failed: boolean } {
    return { failed: true };
  }

  componentDidCatch(error: unknown): void {
    this.props.onFailure(`the WebGL context was lost or could not start (${error instanceof Error ? error.message : String(error)})`);
  }

  render(): ReactNode {
    return this.state.failed ? null : this.props.children;
  }
}
