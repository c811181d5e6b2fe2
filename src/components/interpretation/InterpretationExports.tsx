import { useBoreholes } from '../../api/boreholes';
import { useLine } from '../../api/lines';
import { useProject } from '../../api/projects';
import type { ModelFile } from '../../../shared/model';

/** The writers load on the first click: the line page's bundle stays as it was. */
const writers = async () => {
  const [csv, excavatability, section, dxf] = await Promise.all([
    import('../../../shared/exports/csv'),
    import('../../../shared/exports/excavatability'),
    import('../../../shared/exports/section'),
    import('../../../shared/exports/section-dxf'),
  ]);
  return { depthToRockCsv: csv.depthToRockCsv, WEAVER_1975: excavatability.WEAVER_1975, sectionOfModel: section.sectionOfModel, sectionDxf: dxf.sectionDxf };
};
import { Button } from '../Button';

/** Hands a text file to the browser as a download. */
function download(name: string, type: string, text: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = Object.assign(document.createElement('a'), { href: url, download: name });
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/**
 * The layer interpretation as files (issue 19 item 2), written in the browser by the same writers as
 * the server's exports: the section for CAD and the depth-to-rock table, from the layered model the
 * interpretation makes (as "Save as layered model" stores it), before or without saving it.
 */
export function InterpretationExports({ lineId, model, method }: { lineId: string; model: () => ModelFile; method: string }) {
  const line = useLine(lineId);
  const project = useProject(line.data?.projectId ?? '', { enabled: Boolean(line.data?.projectId) });
  const holes = useBoreholes(lineId);
  if (!line.data || !project.data) return null;
  const l = line.data, p = project.data;
  const section = (sectionOfModel: Awaited<ReturnType<typeof writers>>['sectionOfModel']) =>
    sectionOfModel(model(), {
      title: { project: p.name, line: l.name, what: `Layer interpretation (${method})`, date: new Date().toISOString().slice(0, 10), crs: p.crs ? `EPSG:${p.crs.code} ${p.crs.name}` : null },
      stations: l.stations,
      shots: [],
      holes: (holes.data ?? []).map((h) => ({ name: h.name, kind: h.kind, x: h.x, groundZ: h.groundZResolved, contacts: h.contacts })),
    });
  const stem = `${l.name}-layers-${method}`.replace(/[^A-Za-z0-9._-]+/g, '-');
  return (
    <div className="mt-4 flex flex-wrap items-center gap-3" data-testid="layers-exports">
      <span className="font-semibold text-stone-800">This interpretation as files:</span>
      <Button
        variant="secondary"
        size="sm"
        onClick={async () => {
          const w = await writers();
          download(`${stem}.dxf`, 'application/dxf', w.sectionDxf(section(w.sectionOfModel), { colourRange: p.velocityColours }));
        }}
        data-testid="layers-export-dxf"
      >
        Section for CAD (DXF)
      </Button>
      <Button
        variant="secondary"
        size="sm"
        onClick={async () => {
          const w = await writers();
          const s = section(w.sectionOfModel);
          download(`${stem}-depth-to-rock.csv`, 'text/csv', w.depthToRockCsv(s, { kind: 'interface', index: s.interfaces.length - 1 }, w.WEAVER_1975));
        }}
        data-testid="layers-export-csv"
      >
        Depth-to-rock table (CSV)
      </Button>
    </div>
  );
}
