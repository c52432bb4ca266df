import { batterySchemas, classRuleSchemas, controllerSchemas, motorSchemas, propellerSchemas, vehicleSchemas } from './part-schemas';

export const partSchemasByTable = {
  batteries: batterySchemas,
  motors: motorSchemas,
  controllers: controllerSchemas,
  propellers: propellerSchemas,
  vehicles: vehicleSchemas,
  classRules: classRuleSchemas,
} as const;
