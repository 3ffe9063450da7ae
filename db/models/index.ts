/** All Sequelize models and their associations; tables themselves come from db/migrations. */
import type { Sequelize } from 'sequelize';
import { initAuditEvent } from './audit-event';
import { initEquipment } from './equipment';
import { initFieldRecords } from './field-record';
import { initMail } from './mail';
import { initOrganization } from './organization';
import { initPasswordToken } from './password-token';
import { initPlan } from './plan';
import { initPlanComment } from './plan-comment';
import { initPlanDecision } from './plan-decision';
import { initPlanRevision } from './plan-revision';
import { initPractice } from './practice';
import { initSession } from './session';
import { initUser } from './user';

export function defineModels(sequelize: Sequelize) {
  const models = {
    Organization: initOrganization(sequelize),
    User: initUser(sequelize),
    Session: initSession(sequelize),
    Plan: initPlan(sequelize),
    PlanRevision: initPlanRevision(sequelize),
    AuditEvent: initAuditEvent(sequelize),
    PasswordToken: initPasswordToken(sequelize),
    PlanDecision: initPlanDecision(sequelize),
    PlanComment: initPlanComment(sequelize),
    ...initMail(sequelize),
    ...initPractice(sequelize),
    ...initEquipment(sequelize),
    ...initFieldRecords(sequelize),
  };
  const { User, Session, Plan, PlanRevision, Organization } = models;
  User.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
  Session.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Plan.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  Plan.hasMany(PlanRevision, { foreignKey: 'planId', as: 'revisions' });
  PlanRevision.belongsTo(Plan, { foreignKey: 'planId', as: 'plan' });
  return models;
}

export type Models = ReturnType<typeof defineModels>;
export type { AuditEvent } from './audit-event';
export type { FieldRecord, FieldRecordEntry, FieldRecordPhoto } from './field-record';
export type { Organization } from './organization';
export type { Plan } from './plan';
export type { PlanRevision } from './plan-revision';
export type { PlanComment } from './plan-comment';
export type { PlanDecision } from './plan-decision';
export type { User } from './user';
export type { PracticeAttempt, PracticeExercise } from './practice';
export type { GroundingSet, SetTest, SetEvent } from './equipment';
