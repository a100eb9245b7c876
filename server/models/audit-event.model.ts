import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Append-only record of who changed what; the app never updates or deletes these rows. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare teamId: number | null;
  declare actorId: number | null;
  declare action: string;
  declare subjectType: string;
  declare subjectId: number | null;
  declare details: unknown;
  declare createdAt: CreationOptional<Date>;
}

export function defineAuditEvent(sequelize: Sequelize) {
  AuditEvent.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER, allowNull: true },
      actorId: { type: DataTypes.INTEGER, allowNull: true },
      action: { type: DataTypes.STRING(64), allowNull: false },
      subjectType: { type: DataTypes.STRING(32), allowNull: false },
      subjectId: { type: DataTypes.INTEGER, allowNull: true },
      details: { type: DataTypes.JSON, allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    {
      sequelize,
      tableName: 'audit_events',
      modelName: 'AuditEvent',
      updatedAt: false,
      hooks: {
        beforeUpdate: () => {
          throw new Error('audit events are append-only');
        },
        beforeDestroy: () => {
          throw new Error('audit events are append-only');
        },
      },
    },
  );
  return AuditEvent;
}
