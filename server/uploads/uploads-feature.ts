import type { Feature, Platform } from '../feature';
import { uploadAdminRoutes, uploadServeRoutes } from './upload-routes';

/** Uploaded images: the staff's library under /api, and the files themselves under /uploads. */
export function uploadsFeature(platform: Platform): Feature {
  return {
    name: 'uploads',
    mount(api) {
      api('/admin/uploads', uploadAdminRoutes(platform.images));
    },
    mountSite(site) {
      site('/uploads', uploadServeRoutes(platform.images));
    },
  };
}
