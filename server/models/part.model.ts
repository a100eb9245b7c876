import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Part extends Model<InferAttributes<Part>, InferCreationAttributes<Part>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare partNumber: string;
  declare name: string;
  declare description: string | null;
  declare baselineRevisionId: number | null;
  declare baselineNote: string | null;
  declare baselinePinnedBy: number | null;
  declare baselinePinnedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function definePart(sequelize: Sequelize) {
  Part.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER, allowNull: false },
      partNumber: { type: DataTypes.STRING(40), allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: true },
      baselineRevisionId: { type: DataTypes.INTEGER, allowNull: true },
      baselineNote: { type: DataTypes.STRING(500), allowNull: true },
      baselinePinnedBy: { type: DataTypes.INTEGER, allowNull: true },
      baselinePinnedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'parts', modelName: 'Part' },
  );
  return Part;
}
