import type * as v from 'valibot';
import type { AnyHandler } from './define-handler';
import { archiveHandler, createHandler, getHandler, listHandler, updateHandler } from './handlers/part-handlers';
import { archiveBuild, createBuild, duplicateBuild, getBuildSheet, listBuildColumns, listBuilds, previewChange, updateBuild } from './handlers/build-handlers';
import { listHistoryEntries } from './handlers/history-handlers';
import { getSettings, updateSettings } from './handlers/settings-handlers';
import { storeInfo } from './handlers/store-handlers';
import { exportCsvHandler, exportFleetHandler, importCsvHandler, importFleetHandler } from './handlers/fleet-handlers';
import { backupStoreHandler } from './handlers/backup-handlers';
import { loadDemoHandler } from './handlers/demo-handlers';
import { addPackEvent, getPackHealthSettings, getRunLogHandler, importRunLog, listPackLog, listRunLogsHandler, previewRunLog, removePackEvent, removeRunLog, updatePackHealthSettings, useRunLogFigures } from './handlers/log-handlers';
import { getClass, listClasses, saveClass } from './handlers/class-handlers';
import { inventoryUsage } from './handlers/inventory-handlers';
import { addWorkStep, getWorkOrderHandler, listWorkOrdersHandler, openWorkOrder, setWorkOrderStatus } from './handlers/work-order-handlers';
import { batterySchemas, classRuleSchemas, controllerSchemas, customerSchemas, motorSchemas, propellerSchemas, vehicleSchemas } from './schemas/part-schemas';

/**
 * The one contract between the UI (or the command line) and the data. Both shells relay
 * `call(name, args)` to this map; the renderer's client is typed from it.
 */
export const handlers = {
  'batteries.list': listHandler('batteries'),
  'batteries.get': getHandler('batteries'),
  'batteries.create': createHandler('batteries', batterySchemas.create),
  'batteries.update': updateHandler('batteries', batterySchemas.patch),
  'batteries.archive': archiveHandler('batteries'),
  'motors.list': listHandler('motors'),
  'motors.get': getHandler('motors'),
  'motors.create': createHandler('motors', motorSchemas.create),
  'motors.update': updateHandler('motors', motorSchemas.patch),
  'motors.archive': archiveHandler('motors'),
  'controllers.list': listHandler('controllers'),
  'controllers.get': getHandler('controllers'),
  'controllers.create': createHandler('controllers', controllerSchemas.create),
  'controllers.update': updateHandler('controllers', controllerSchemas.patch),
  'controllers.archive': archiveHandler('controllers'),
  'propellers.list': listHandler('propellers'),
  'propellers.get': getHandler('propellers'),
  'propellers.create': createHandler('propellers', propellerSchemas.create),
  'propellers.update': updateHandler('propellers', propellerSchemas.patch),
  'propellers.archive': archiveHandler('propellers'),
  'vehicles.list': listHandler('vehicles'),
  'vehicles.get': getHandler('vehicles'),
  'vehicles.create': createHandler('vehicles', vehicleSchemas.create),
  'vehicles.update': updateHandler('vehicles', vehicleSchemas.patch),
  'vehicles.archive': archiveHandler('vehicles'),
  'classes.list': listClasses,
  'classes.get': getClass,
  'classes.save': saveClass,
  'classRules.list': listHandler('classRules'),
  'classRules.get': getHandler('classRules'),
  'classRules.create': createHandler('classRules', classRuleSchemas.create),
  'classRules.update': updateHandler('classRules', classRuleSchemas.patch),
  'classRules.archive': archiveHandler('classRules'),
  'inventory.usage': inventoryUsage,
  'customers.list': listHandler('customers'),
  'customers.get': getHandler('customers'),
  'customers.create': createHandler('customers', customerSchemas.create),
  'customers.update': updateHandler('customers', customerSchemas.patch),
  'customers.archive': archiveHandler('customers'),
  'builds.list': listBuilds,
  'builds.listColumns': listBuildColumns,
  'builds.get': getBuildSheet,
  'builds.create': createBuild,
  'builds.update': updateBuild,
  'builds.archive': archiveBuild,
  'builds.duplicate': duplicateBuild,
  'builds.preview': previewChange,
  'workOrders.open': openWorkOrder,
  'workOrders.addStep': addWorkStep,
  'workOrders.setStatus': setWorkOrderStatus,
  'workOrders.list': listWorkOrdersHandler,
  'workOrders.get': getWorkOrderHandler,
  'history.list': listHistoryEntries,
  'settings.get': getSettings,
  'settings.update': updateSettings,
  'store.info': storeInfo,
  // Fleet files, CSV, the demo fleet and backups (restore is command-line only: it replaces the file).
  'fleet.export': exportFleetHandler,
  'fleet.import': importFleetHandler,
  'fleet.exportCsv': exportCsvHandler,
  'fleet.importCsv': importCsvHandler,
  'demo.load': loadDemoHandler,
  'store.backup': backupStoreHandler,
  // Pack logs and run logs (handlers/log-handlers.ts).
  'packLog.list': listPackLog,
  'packLog.add': addPackEvent,
  'packLog.remove': removePackEvent,
  'settings.packHealth': getPackHealthSettings,
  'settings.updatePackHealth': updatePackHealthSettings,
  'runLogs.preview': previewRunLog,
  'runLogs.import': importRunLog,
  'runLogs.list': listRunLogsHandler,
  'runLogs.get': getRunLogHandler,
  'runLogs.useFigures': useRunLogFigures,
  'runLogs.remove': removeRunLog,
} satisfies Record<string, AnyHandler>;

export type Handlers = typeof handlers;
export type HandlerName = keyof Handlers;
/** What a caller passes: the schema's input side, so defaults may be left out. */
export type ApiInput<K extends HandlerName> = v.InferInput<Handlers[K]['input']>;
export type ApiOutput<K extends HandlerName> = Awaited<ReturnType<Handlers[K]['run']>>;
