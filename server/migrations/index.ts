import { Foundation1764633600000 } from './1764633600000-Foundation';
import { FieldData1764640000000 } from './1764640000000-FieldData';
import { VelocityModels1764650000000 } from './1764650000000-VelocityModels';
import { Runs1764660000000 } from './1764660000000-Runs';
import { Reports1764670000000 } from './1764670000000-Reports';
import { IdempotencyKeys1764680000000 } from './1764680000000-IdempotencyKeys';
import { OrganisationAndReportSnapshots1764690000000 } from './1764690000000-OrganisationAndReportSnapshots';
import { StoredReads1764700000000 } from './1764700000000-StoredReads';
import { Inversions1796419332383 } from './1796419332383-Inversions';
import { InversionReports1796430000000 } from './1796430000000-InversionReports';
import { StationRevisions1796444183694 } from './1796444183694-StationRevisions';
import { PickSetRetirement1796445000000 } from './1796445000000-PickSetRetirement';
import { Records1796447000000 } from './1796447000000-Records';
import { Boreholes1796450000000 } from './1796450000000-Boreholes';
import { PasswordResets1796460000000 } from './1796460000000-PasswordResets';
import { ProjectVelocityColours1796470000000 } from './1796470000000-ProjectVelocityColours';
import { Coordinates1796480000000 } from './1796480000000-Coordinates';
import { Ensembles1796490000000 } from './1796490000000-Ensembles';

/** Every migration, oldest first. Add new ones at the end. */
export const migrations = [
  Foundation1764633600000, FieldData1764640000000, VelocityModels1764650000000, Runs1764660000000, Reports1764670000000,
  IdempotencyKeys1764680000000, OrganisationAndReportSnapshots1764690000000, StoredReads1764700000000, Inversions1796419332383,
  InversionReports1796430000000, StationRevisions1796444183694, PickSetRetirement1796445000000, Records1796447000000,
  Boreholes1796450000000, PasswordResets1796460000000, ProjectVelocityColours1796470000000, Coordinates1796480000000,
  Ensembles1796490000000,
];
