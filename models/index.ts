// Every model, imported explicitly, and every association in one place.
import { ApiToken } from './ApiToken';
import { Area } from './Area';
import { AuditEvent } from './AuditEvent';
import { SignInAttempt } from './SignInAttempt';
import { Site } from './Site';
import { SiteMembership } from './SiteMembership';
import { Survey } from './Survey';
import { Trap } from './Trap';
import { User } from './User';

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

export { ApiToken, Area, AuditEvent, SignInAttempt, Site, SiteMembership, Survey, Trap, User };
