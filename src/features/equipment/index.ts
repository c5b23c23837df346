// The equipment feature's public face: the workspace's vessels, filters and dryers.
export { getEquipmentQueryOptions, useEquipment } from './api/get-equipment';
