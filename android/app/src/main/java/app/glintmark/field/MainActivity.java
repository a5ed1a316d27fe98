package app.glintmark.field;

import com.getcapacitor.BridgeActivity;

public class MainActivity extends BridgeActivity {}
