import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An immutable saved state of a study; rows are inserted, never updated. */
export class Revision extends Model<InferAttributes<Revision>, InferCreationAttributes<Revision>> {
  declare id: CreationOptional<number>;
  declare studyId: number;
  declare number: number;
  declare params: unknown;
  declare summary: unknown;
  declare authorId: number;
  declare message: string;
  declare basedOnNumber: number | null;
  declare restoredFromNumber: number | null;
  declare createdAt: CreationOptional<Date>;
}

export function defineRevision(sequelize: Sequelize) {
  Revision.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      studyId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      params: { type: DataTypes.JSON, allowNull: false },
      summary: { type: DataTypes.JSON, allowNull: true },
      authorId: { type: DataTypes.INTEGER, allowNull: false },
      message: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      basedOnNumber: { type: DataTypes.INTEGER, allowNull: true },
      restoredFromNumber: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'revisions', modelName: 'Revision', updatedAt: false },
  );
  return Revision;
}
