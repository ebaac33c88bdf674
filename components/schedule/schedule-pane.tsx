// The panel schedule and its CSV import, one after the other in the same place: the schedule first, the import
// form when asked for, back to the schedule once the circuits are placed or the import is cancelled.
import { useState } from 'react';
import type { CsvReadResult, ImportedCircuit } from '@/editor/schedule/schedule-csv';
import { CsvImportForm } from './csv-import-form';
import { PanelScheduleView, type PanelScheduleViewProps } from './panel-schedule-view';

export interface SchedulePaneProps extends Omit<PanelScheduleViewProps, 'onImportCsv'> {
  maxCsvBytes: number;
  onReadCsv: (busId: string, text: string) => CsvReadResult | null;
  onImportCircuits: (busId: string, circuits: ImportedCircuit[]) => number;
  onMessage: (text: string) => void;
}

export function SchedulePane(p: SchedulePaneProps) {
  const [importing, setImporting] = useState(false);
  const s = p.schedule;
  if (importing && s && p.editable) {
    return (
      <CsvImportForm
        key={s.busId}
        panelName={s.name}
        maxBytes={p.maxCsvBytes}
        onRead={(text) => p.onReadCsv(s.busId, text)}
        onImport={(circuits) => p.onImportCircuits(s.busId, circuits)}
        onDone={(m) => {
          setImporting(false);
          p.onMessage(m);
        }}
        onCancel={() => setImporting(false)}
      />
    );
  }
  return <PanelScheduleView {...p} onImportCsv={() => setImporting(true)} />;
}
