/** The eight candidate definitions both benches audit Chile with (fitted to its extent by hand). */
export const CHILE_CANDIDATES = [
  '+proj=tmerc +lat_0=0 +lon_0=-71 +k_0=0.9996 +x_0=500000 +y_0=10000000 +ellps=WGS84',
  '+proj=utm +zone=19 +south +ellps=WGS84',
  '+proj=laea +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=aeqd +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=lcc +lat_1=-24 +lat_2=-50 +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=aea +lat_1=-24 +lat_2=-50 +lat_0=-37 +lon_0=-71 +x_0=0 +y_0=0 +ellps=WGS84',
  '+proj=merc +lon_0=-71 +ellps=WGS84',
  '+proj=stere +lat_0=-37 +lon_0=-71 +k_0=1 +x_0=0 +y_0=0 +ellps=WGS84',
];
