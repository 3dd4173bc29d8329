"""AWC SDPWS-2015 Special Design Provisions for Wind and Seismic: one module per clause group."""
