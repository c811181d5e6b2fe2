"""Writes SEG-Y files with Debian's python3-segyio (a general-purpose SEG-Y library, the outside
reference for tests/references/records/segyio.test.ts) and a manifest of what segyio reads back.
Usage: python3 segyio-fixtures.py DIR  (writes DIR/*.sgy and DIR/manifest.json)
Also: python3 segyio-fixtures.py --read FILE  (prints segyio's view of a file as JSON)."""
import json, sys
import numpy as np
import segyio

TF = segyio.TraceField
CASES = [
    # name, sample format, byte order, measurement system (1 m, 2 ft)
    ('ibm-big', 1, 'big', 1),
    ('ieee-big', 5, 'big', 1),
    ('ieee-little', 5, 'little', 1),
    ('int16-big', 3, 'big', 2),
    ('int32-big', 2, 'big', 1),
]


def view(path, endian='big'):
    with segyio.open(path, ignore_geometry=True, endian=endian) as f:
        keys = {'channel': TF.TraceNumber, 'sx': TF.SourceX, 'gx': TF.GroupX, 'scalco': TF.SourceGroupScalar,
                'gelev': TF.ReceiverGroupElevation, 'selev': TF.SourceSurfaceElevation, 'scalel': TF.ElevationScalar,
                'delrt': TF.DelayRecordingTime, 'ns': TF.TRACE_SAMPLE_COUNT, 'dt': TF.TRACE_SAMPLE_INTERVAL, 'trid': TF.TraceIdentificationCode}
        return {
            'format': int(f.bin[segyio.BinField.Format]),
            'interval_us': int(f.bin[segyio.BinField.Interval]),
            'text': [line for line in (bytes(f.text[0]).decode('ascii', 'replace')[i:i + 80].rstrip() for i in range(0, 3200, 80)) if line.strip()],
            'traces': [{**{k: int(f.header[i][v]) for k, v in keys.items()}, 'samples': [float(x) for x in f.trace[i]]} for i in range(f.tracecount)],
        }


def write(directory):
    rng = np.random.default_rng(12)
    manifest = {}
    for name, fmt, endian, units in CASES:
        spec = segyio.spec()
        spec.format = fmt
        spec.samples = list(range(50))
        spec.tracecount = 4
        spec.endian = endian
        path = f'{directory}/{name}.sgy'
        with segyio.create(path, spec) as f:
            f.text[0] = segyio.tools.create_text_header({1: 'INVENTED TEST LINE TQ-9 (NOT A REAL SURVEY)', 2: f'SAMPLE FORMAT {fmt}'})
            f.bin.update(hdt=250, hns=50, format=fmt, mfeet=units)
            for i in range(4):
                f.header[i] = {TF.TRACE_SEQUENCE_LINE: i + 1, TF.TraceNumber: 21 + i, TF.SourceX: -250, TF.GroupX: 1000 * i + 375,
                               TF.SourceGroupScalar: -100, TF.ReceiverGroupElevation: 10123 + i, TF.SourceSurfaceElevation: 10100,
                               TF.ElevationScalar: -100, TF.DelayRecordingTime: -2 if i == 0 else 3, TF.TRACE_SAMPLE_COUNT: 50,
                               TF.TRACE_SAMPLE_INTERVAL: 250, TF.TraceIdentificationCode: 2 if i == 3 else 1}
                if fmt in (2, 3):
                    data = rng.integers(-30000, 30000, 50).astype(np.int16 if fmt == 3 else np.int32)
                else:
                    data = (rng.standard_normal(50) * 10.0 ** rng.integers(-3, 4, 50)).astype(np.float32)
                f.trace[i] = data
        manifest[name] = {'units': units, **view(path, endian)}
    json.dump(manifest, open(f'{directory}/manifest.json', 'w'))


if __name__ == '__main__':
    if sys.argv[1] == '--read':
        print(json.dumps(view(sys.argv[2])))
    else:
        write(sys.argv[1])
