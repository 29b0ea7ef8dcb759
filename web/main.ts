// Front-end entry: defines the page element; index.html places it. No inline script (the CSP forbids it).
import './elements/panel-app';
