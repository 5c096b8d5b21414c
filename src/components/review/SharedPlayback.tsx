// the Response pane of the workbench, read-only, for a guest: the shared revision's
// document is loaded into the workbench store (no assembly, no base revision, so nothing
// is fetched from or kept for the team) and run in the guest's own browser.
import { useState } from 'react';
import ResponsePane from '../workbench/ResponsePane';
import { useWorkbench } from '../../lib/workbench/store';
import type { WorkbenchDocument } from '../../lib/schemas/workbench';

export default function SharedPlayback({ doc }: { doc: WorkbenchDocument }) {
  // load once, before the pane's first render
  useState(() => {
    useWorkbench.getState().load({ assembly: null, base: null, doc });
    return true;
  });
  if (doc.exposure.outdoor.mode === 'series') {
    return <p className="text-sm text-ink-soft">This revision runs on an uploaded hourly series that stays with the team; the figures above are the analytic ones.</p>;
  }
  return <ResponsePane />;
}
