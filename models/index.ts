// Every model, imported explicitly, and every association in one place.
import { ApiToken } from './ApiToken';
import { Area } from './Area';
import { AuditEvent } from './AuditEvent';
import { FieldNote } from './FieldNote';
import { InstrumentProfile } from './InstrumentProfile';
import { Invitation } from './Invitation';
import { SignInAttempt } from './SignInAttempt';
import { Site } from './Site';
import { SiteCostSettings } from './SiteCostSettings';
import { SiteMembership } from './SiteMembership';
import { SourceFile } from './SourceFile';
import { Survey } from './Survey';
import { Test } from './Test';
import { TestSeries } from './TestSeries';
import { Trap } from './Trap';
import { TrapVerdict } from './TrapVerdict';
import { Upload } from './Upload';
import { User } from './User';
import { WorkOrder } from './WorkOrder';

User.belongsToMany(Site, { through: SiteMembership, foreignKey: 'userId', otherKey: 'siteId', as: 'sites' });
Site.belongsToMany(User, { through: SiteMembership, foreignKey: 'siteId', otherKey: 'userId', as: 'users' });
SiteMembership.belongsTo(User, { foreignKey: 'userId' });
SiteMembership.belongsTo(Site, { foreignKey: 'siteId' });

Site.hasMany(Area, { foreignKey: 'siteId', as: 'areas' });
Area.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });

Site.hasMany(Trap, { foreignKey: 'siteId', as: 'traps' });
Trap.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
Area.hasMany(Trap, { foreignKey: 'areaId', as: 'traps' });
Trap.belongsTo(Area, { foreignKey: 'areaId', as: 'area' });

Site.hasMany(Survey, { foreignKey: 'siteId', as: 'surveys' });
Survey.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });

User.hasMany(ApiToken, { foreignKey: 'userId', as: 'apiTokens' });
ApiToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });

AuditEvent.belongsTo(User, { foreignKey: 'userId', as: 'user' });
AuditEvent.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });

Site.hasMany(Upload, { foreignKey: 'siteId', as: 'uploads' });
Upload.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
Upload.belongsTo(Survey, { foreignKey: 'surveyId', as: 'survey' });
Upload.belongsTo(User, { foreignKey: 'createdBy', as: 'creator' });
Upload.hasMany(SourceFile, { foreignKey: 'uploadId', as: 'files' });
SourceFile.belongsTo(Upload, { foreignKey: 'uploadId', as: 'upload' });
SourceFile.belongsTo(SourceFile, { foreignKey: 'containerId', as: 'container' });
SourceFile.belongsTo(InstrumentProfile, { foreignKey: 'profileId', as: 'profile' });
InstrumentProfile.belongsTo(User, { foreignKey: 'createdBy', as: 'creator' });

Test.belongsTo(Trap, { foreignKey: 'trapId', as: 'trap' });
Trap.hasMany(Test, { foreignKey: 'trapId', as: 'tests' });
Test.belongsTo(Survey, { foreignKey: 'surveyId', as: 'survey' });
Test.belongsTo(Upload, { foreignKey: 'uploadId', as: 'upload' });
Test.belongsTo(SourceFile, { foreignKey: 'sourceFileId', as: 'sourceFile' });
Test.hasOne(TestSeries, { foreignKey: 'testId', as: 'series' });
TestSeries.belongsTo(Test, { foreignKey: 'testId' });

TrapVerdict.belongsTo(Trap, { foreignKey: 'trapId', as: 'trap' });
TrapVerdict.belongsTo(User, { foreignKey: 'decidedBy', as: 'decider' });
Trap.hasMany(TrapVerdict, { foreignKey: 'trapId', as: 'verdicts' });

Site.hasOne(SiteCostSettings, { foreignKey: 'siteId', as: 'costSettings' });
SiteCostSettings.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });

WorkOrder.belongsTo(Trap, { foreignKey: 'trapId', as: 'trap' });
WorkOrder.belongsTo(Survey, { foreignKey: 'surveyId', as: 'survey' });
WorkOrder.belongsTo(User, { foreignKey: 'assigneeId', as: 'assignee' });
Trap.hasMany(WorkOrder, { foreignKey: 'trapId', as: 'workOrders' });

FieldNote.belongsTo(Trap, { foreignKey: 'trapId', as: 'trap' });
FieldNote.belongsTo(User, { foreignKey: 'createdBy', as: 'author' });

export {
  ApiToken, Area, AuditEvent, FieldNote, InstrumentProfile, Invitation, SignInAttempt, Site, SiteCostSettings, SiteMembership,
  SourceFile, Survey, Test, TestSeries, Trap, TrapVerdict, Upload, User, WorkOrder,
};
