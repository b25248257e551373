'use client';

import { Button } from '@/components/ui/button';

/** Opens the browser's print dialog (save as PDF there); hidden on paper. */
export function PrintButton() {
  return <Button variant="secondary" className="no-print" onClick={() => window.print()} data-testid="print-report">Print or save as PDF</Button>;
}
