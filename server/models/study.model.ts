import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Study extends Model<InferAttributes<Study>, InferCreationAttributes<Study>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare partId: number;
  declare ownerId: number;
  declare title: string;
  declare forkedFromRevisionId: number | null;
  declare latestRevisionNumber: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineStudy(sequelize: Sequelize) {
  Study.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER, allowNull: false },
      partId: { type: DataTypes.INTEGER, allowNull: false },
      ownerId: { type: DataTypes.INTEGER, allowNull: false },
      title: { type: DataTypes.STRING(160), allowNull: false },
      forkedFromRevisionId: { type: DataTypes.INTEGER, allowNull: true },
      latestRevisionNumber: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    // `version: true`: every update carries `WHERE version = n`, so a stale writer fails.
    { sequelize, tableName: 'studies', modelName: 'Study', version: true },
  );
  return Study;
}
