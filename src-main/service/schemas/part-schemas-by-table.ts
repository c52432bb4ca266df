import { batterySchemas, classRuleSchemas, classSchemas, controllerSchemas, motorSchemas, propellerSchemas, vehicleSchemas } from './part-schemas';

export const partSchemasByTable = {
  batteries: batterySchemas,
  motors: motorSchemas,
  controllers: controllerSchemas,
  propellers: propellerSchemas,
  vehicles: vehicleSchemas,
  classes: classSchemas,
  classRules: classRuleSchemas,
} as const;
